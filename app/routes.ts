import { type RouteConfig, index, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  route("healthz", "routes/healthz.ts"),
  route("signup", "routes/signup.tsx"),
  route("signin", "routes/signin.tsx"),
  route("signout", "routes/signout.ts"),
  route("verify", "routes/verify.tsx"),
  route("forgot", "routes/forgot.tsx"),
  route("reset", "routes/reset.tsx"),
  route("account", "routes/account.tsx"),
  route("workspace", "routes/workspace.tsx"),
  route("workspace/new", "routes/workspace.new.tsx"),
  route("invite/:token", "routes/invite.$token.tsx"),
  route("api/v1/me", "routes/api.v1.me.ts"),
  route("api/*", "routes/api.not-found.ts"),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
