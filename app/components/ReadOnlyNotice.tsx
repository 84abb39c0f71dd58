// Said at the top of a page whose forms a member's role cannot use (their fields are shown disabled).
export function ReadOnlyNotice({ what, role }: { what: string; role: string }) {
  return (
    <p className="rounded-md border border-slate-300 bg-slate-50 px-3 py-2 text-sm text-slate-700" role="note" data-testid="read-only-notice">
      You can view this {what}; your role ({role}) cannot change it.
    </p>
  );
}
