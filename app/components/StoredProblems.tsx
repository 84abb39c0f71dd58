// The problems of a stored document that does not pass its checks (app/lib/projects/stored-doc.ts): each named in plain
// words with the value stored, the first few of `count`. Shared by the system page, its candidates needing review and a
// field check's page.
import type { DocProblem } from "~/lib/projects/stored-doc";

/** `problems`: the first of `count` problems; `small`: the candidates panel's smaller text. */
export function StoredProblems({ problems, count, small = false }: { problems: readonly Pick<DocProblem, "label" | "message" | "stored">[]; count: number; small?: boolean }) {
  return (
    <ul className={`list-disc pl-5 ${small ? "text-xs" : "text-sm"}`}>
      {problems.map((p, i) => (
        <li key={i}>
          <span className="font-semibold">{p.label}</span>: {p.message}
          {p.stored ? <span className="text-slate-600"> Stored: {p.stored}.</span> : null}
        </li>
      ))}
      {count > problems.length ? <li>…and {count - problems.length} more.</li> : null}
    </ul>
  );
}
