// The analysis jobs the server runs on stored uploads — in the analysis worker for big files
// (app/lib/libraries/upload-analysis.server.ts decides), in the calling thread for small ones. Pure.
import * as v from "valibot";
import { MappingSchema, type Policy } from "../import";
import { analyseStored, summarise, type UploadSummary } from "./upload-analysis";
import { planBuffers, planImport, uploadReport, type ImportPlan, type UploadReport } from "./import-plan";
import type { DocProblem } from "../projects/stored-doc";

export type AnalysisJob =
  | { kind: "summary"; bytes: Uint8Array; mappingJson: string | null; mapping?: unknown; /** The page of the maker's minimum flow list (1 when absent). */ minFlowPage?: number | null }
  | {
      kind: "import";
      bytes: Uint8Array;
      mappingJson: string | null;
      /** Given: applied as is. Absent: the library's saved mapping when it fits, else the suggestion. */
      mapping?: unknown;
      /** Overrides the mapping's policy (the API's `policy` field). */
      policy?: Policy;
      /** Also return the report the API answers with. */
      report?: boolean;
      /** Make the import plan (default true; a report-only call sets false: no plan, no LOAD DATA lines). */
      plan?: boolean;
    };

export type ImportAnalysis = {
  /** Null when no curve set can be written. */
  plan: ImportPlan | null;
  /** Why the mapping used cannot be imported with (a suggestion that MappingSchema refuses), else null. */
  mappingRefused: string | null;
  report: UploadReport | null;
  /** The library's saved mapping when it was looked at (no mapping given) and could not be read: what is wrong with it (set aside). */
  savedMappingProblems: DocProblem[];
};

export type AnalysisOutput = { summary: UploadSummary } | ImportAnalysis;

export function runJob(job: AnalysisJob): AnalysisOutput {
  const lib = { mappingJson: job.mappingJson };
  if (job.kind === "summary") return { summary: summarise(analyseStored(job.bytes, lib, job.mapping), job.minFlowPage) };
  let a = analyseStored(job.bytes, lib, job.mapping);
  const { savedMappingProblems } = a; // (the policy's second pass below is given its mapping: it looks at no saved one)
  if (job.policy && a.mapping.policy !== job.policy) a = analyseStored(job.bytes, lib, { ...a.mapping, policy: job.policy });
  const check = v.safeParse(MappingSchema, a.mapping);
  const mappingRefused = check.success ? null : check.issues.map((i) => i.message).join("; ");
  return { plan: mappingRefused || job.plan === false ? null : planImport(a), mappingRefused, report: job.report ? uploadReport(a) : null, savedMappingProblems };
}

/** Buffers of an output that can be moved to the other thread instead of copied. */
export const transferablesOf = (out: AnalysisOutput): ArrayBuffer[] => ("plan" in out && out.plan ? planBuffers(out.plan) : []);
