// A record page's head: the trail back up (Crumbs), the page's title, and what the caller puts below it
// (a line about the record). `titleClass` adds to the title's classes (e.g. to sit a badge beside it).
import type { ReactNode } from "react";
import { Crumbs } from "./Crumbs";

export function PageHead({ trail, title, titleClass, children }: { trail: readonly (readonly [to: string, label: string])[]; title: ReactNode; titleClass?: string; children?: ReactNode }) {
  return (
    <div>
      <Crumbs trail={trail} />
      <h1 className={`${titleClass ?? ""} text-2xl font-bold text-brand-900`.trim()}>{title}</h1>
      {children}
    </div>
  );
}
