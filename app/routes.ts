import { type RouteConfig, index, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  route("healthz", "routes/healthz.ts"),
  // accounts
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
  route("dev/mailbox", "routes/dev.mailbox.tsx"),
  // pump libraries
  route("libraries", "routes/libraries.tsx"),
  route("libraries/:id", "routes/libraries.$id.tsx"),
  route("libraries/:id/upload", "routes/libraries.$id.upload.tsx"),
  route("libraries/:id/uploads/:uploadId", "routes/libraries.$id.uploads.$uploadId.tsx"),
  // engineer's workspace
  route("projects", "routes/projects.tsx"),
  route("projects/:id", "routes/projects.$id.tsx"),
  route("systems/:id", "routes/systems.$id.tsx"),
  route("systems/:id/search", "routes/systems.$id.search.tsx"),
  route("selections/:id", "routes/selections.$id.tsx"),
  route("selections/:id/export.csv", "routes/selections.$id.export-csv.ts"),
  route("selections/:id/export.json", "routes/selections.$id.export-json.ts"),
  // API
  route("api/v1/me", "routes/api.v1.me.ts"),
  route("api/v1/libraries", "routes/api.v1.libraries.ts"),
  route("api/v1/libraries/:id/curves", "routes/api.v1.libraries.$id.curves.ts"),
  route("api/v1/calc/pipe-loss", "routes/api.v1.calc.pipe-loss.ts"),
  route("api/v1/calc/system-curve", "routes/api.v1.calc.system-curve.ts"),
  route("api/v1/calc/operating-point", "routes/api.v1.calc.operating-point.ts"),
  route("api/v1/systems/:id/preview", "routes/api.v1.systems.$id.preview.ts"),
  route("api", "routes/api-docs.tsx"),
  route("api/*", "routes/api.not-found.ts"),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
