// The words of a route's ErrorBoundary by status (app/components/RouteError.tsx). Expected sentences
// are our own (that file); statuses as React Router reports them.
import { describe, expect, test } from "vitest";
import { routeErrorText } from "./RouteError";

const words = { what: "this project", back: { href: "/projects", label: "Your projects" } };
/** What React Router hands an ErrorBoundary for a thrown data()/Response (isRouteErrorResponse's shape). */
const response = (status: number, body?: string | { detail: string }) => ({ status, statusText: "", internal: false, data: body });

describe("routeErrorText", () => {
  test("404 names what was not found, in the route's words", () => {
    expect(routeErrorText(response(404), words)).toEqual({
      title: "Not found",
      detail: "We could not find this project. It may have been deleted, the link may be wrong, or it belongs to a workspace you are not in.",
    });
    expect(routeErrorText(response(404), { ...words, notFound: "Gone.", notFoundTitle: "Page not found" })).toEqual({ title: "Page not found", detail: "Gone." });
  });
  test("403 and 400 keep the server's own sentence when there is one", () => {
    expect(routeErrorText(response(403, "Viewers may not change systems."), words).detail).toBe("Viewers may not change systems.");
    expect(routeErrorText(response(403), words).detail).toContain("does not allow you to see or change this project");
    expect(routeErrorText(response(400), words).title).toBe("That request could not be read");
  });
  test("409 (a refusal until something is put right, e.g. stored inputs that fail the checks) says so, and reads a `{ detail }` refusal's sentence", () => {
    const said = "The stored inputs of the system \"S\" do not pass the system checks (1 problem: temperature).";
    expect(routeErrorText(response(409, { detail: said }), words)).toEqual({ title: "Not possible as things stand", detail: said });
    expect(routeErrorText(response(409, said), words).detail).toBe(said);
  });
  test("503 says the data is safe; anything else thrown is not shown to the user outside development", () => {
    expect(routeErrorText(response(503), words).title).toBe("Temporarily unavailable");
    const boom = new Error("SELECT failed: secret detail");
    expect(routeErrorText(boom, words).detail).not.toContain("secret");
    expect(routeErrorText(boom, words, true).detail).toBe("SELECT failed: secret detail");
  });
  test("an unexpected status is named with the route's words", () => {
    expect(routeErrorText(response(418), words)).toEqual({ title: "418", detail: "Something went wrong while showing this project." });
  });
});
