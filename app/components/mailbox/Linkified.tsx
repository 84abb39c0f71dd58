import { Fragment } from "react";

const URL_RE = /(https?:\/\/[^\s<>"']+)/g;

/** Plain text with its http(s) links made clickable. */
export function Linkified({ text }: { text: string }) {
  const pieces = text.split(URL_RE);
  return (
    <>
      {pieces.map((p, i) => {
        if (i % 2 === 0) return <Fragment key={i}>{p}</Fragment>;
        const trail = /[.,;:!?)\]]+$/.exec(p)?.[0] ?? "";
        const href = trail ? p.slice(0, -trail.length) : p;
        return (
          <Fragment key={i}>
            <a href={href} className="break-all">
              {href}
            </a>
            {trail}
          </Fragment>
        );
      })}
    </>
  );
}
