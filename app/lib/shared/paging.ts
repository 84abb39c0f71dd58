// A long list shown a page at a time (the pump search's results, a library's models): which page is
// shown, and the link to another page that keeps the rest of the query string (the filters).

export type Paging = { page: number; pages: number; pageSize: number; total: number };

/**
 * The page to show of `total` rows at `pageSize` a page: the asked page truncated to a whole number,
 * the first when none is asked (undefined or null) or it is NaN or below 1, the last when it is past the end (Infinity
 * included). An empty list has one (empty) page. `first` is the index of the page's first row.
 */
export function pageOf(total: number, pageSize: number, asked?: number | null): Paging & { first: number } {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const want = asked == null || Number.isNaN(asked) ? 1 : Math.trunc(asked);
  const page = Math.min(Math.max(1, want), pages);
  return { page, pages, pageSize, total, first: (page - 1) * pageSize };
}

/** The link to another page: the current query string (`search`) with `page` (or the list's own key) set; repeated keys kept in order. */
export function pageHref(search: string, page: number, key = "page"): string {
  const q = new URLSearchParams(search);
  q.set(key, String(page));
  return `?${q}`;
}

/** An API list's links to its pages: path and query string (the rest of the query kept, `page` set); prev and next null at the ends. */
export type PageLinks = { self: string; first: string; prev: string | null; next: string | null; last: string };

/** The links of `paging` for a request to `url` (the API's list routes answer them beside `paging`). */
export function pageLinks(url: URL, paging: Paging): PageLinks {
  const at = (page: number) => `${url.pathname}${pageHref(url.search, page)}`;
  return {
    self: at(paging.page),
    first: at(1),
    prev: paging.page > 1 ? at(paging.page - 1) : null,
    next: paging.page < paging.pages ? at(paging.page + 1) : null,
    last: at(paging.pages),
  };
}
