// A message as the SMTP stand-in's HTTP API returns it (fixtures/smtp/server.ts). Types only, so the
// mailbox page's components can use them in the browser.
export type MailboxMessage = {
  id: string;
  receivedAt: string;
  envelope: { from: string; to: string[] };
  from: string;
  to: string[];
  subject: string;
  date: string | null;
  messageId: string | null;
  text: string | null;
  html: string | null;
  links: string[];
  size: number;
};
export type MailboxMessageFull = MailboxMessage & { headers: Record<string, string>; raw: string };
