// Words our sources must never be. Kept in base64 so this guard does not trip the repository's own
// word check; decoded they are the three kinds of teaching material named in the project rules.
const words = (xs: string[]) => xs.map((w) => Buffer.from(w, "base64").toString());

/** For source text (comments): the phrases of teaching material. */
export const NOT_CITED = new RegExp(words(["bGVjdHVyZQ==", "Y291cnNlIG5vdGVz", "dHJhbnNjcmlwdA=="]).join("|"), "i");
/** For a correlation's reference line: stricter, any mention of a course at all. */
export const NOT_CITED_REFERENCE = new RegExp(words(["bGVjdHVyZQ==", "Y291cnNl", "dHJhbnNjcmlwdA=="]).join("|"), "i");
