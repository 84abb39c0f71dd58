// Previous / next links between the pages of a long list, keeping the filters in the query string
// (plain links: they work without JavaScript). Nothing when the list fits one page.
import { Link, useLocation } from "react-router";
import { pageHref } from "~/lib/shared/paging";

/** `param`: the query key of the page (default "page"; a page with two lists gives one its own). */
export function Pager({ paging, label, param }: { paging: { page: number; pages: number }; label: string; param?: string }) {
  const { search } = useLocation();
  if (paging.pages <= 1) return null;
  const href = (page: number) => pageHref(search, page, param);
  return (
    <nav aria-label={label} className="mt-3 flex items-center gap-3 text-sm">
      {paging.page > 1 ? <Link to={href(paging.page - 1)} rel="prev">← Previous</Link> : null}
      <span className="text-slate-600">Page {paging.page} of {paging.pages}</span>
      {paging.page < paging.pages ? <Link to={href(paging.page + 1)} rel="next">Next →</Link> : null}
    </nav>
  );
}
