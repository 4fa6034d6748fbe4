// Response shapes of the local mailbox route (development only), shared by `server/meta/` and the client.

export type MailboxMessage = { id: string; from: string; to: string[]; subject: string; text: string; receivedAt: string };
/** GET /api/dev/mailbox: the caller's club's mail, newest first, password resets left out. */
export type MailboxResponse = { messages: MailboxMessage[] };
/** GET /api/meta */
export type MetaResponse = { mailbox: boolean };
