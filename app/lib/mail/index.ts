// Mail's public face: the outbox (every message is a row first), the templates, and the development
// mailbox client (the SMTP stand-in's HTTP API).
export * from "./outbox.server";
export * from "./mailbox.server";
export * from "./mailbox-page.server";
export * from "./templates";
