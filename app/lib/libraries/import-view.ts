/** One import of a library as the library page shows it (pure: the page's component imports it). */
export type ImportView = {
  id: number;
  uploadId: number | null;
  status: "running" | "done" | "failed" | "stopped";
  pointsTotal: number;
  pointsWritten: number;
  revisionNumber: number | null;
  message: string;
  createdAt: string;
};
