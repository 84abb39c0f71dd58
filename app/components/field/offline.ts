// Registers the field pages' service worker (public/sw.js) and asks it to keep copies of the
// pages this contractor may need on site: the list, each selection's form (with its curve data,
// which is in the page) and the scripts and styles they load.
import { useEffect } from "react";

export function useOfflineCopies(paths: string[]) {
  const key = paths.join(" ");
  useEffect(() => {
    if (!("serviceWorker" in navigator) || !key) return;
    let cancelled = false;
    navigator.serviceWorker
      .register("/sw.js", { scope: "/" })
      .then(() => navigator.serviceWorker.ready)
      .then((registration) => {
        if (cancelled) return;
        const assets = [...document.querySelectorAll<HTMLScriptElement | HTMLLinkElement>("script[src], link[rel=modulepreload], link[rel=stylesheet], link[rel=manifest], link[rel=icon]")]
          .map((el) => ("src" in el && el.src ? el.src : (el as HTMLLinkElement).href))
          .filter(Boolean);
        registration.active?.postMessage({ type: "keep", pages: key.split(" "), assets });
      })
      .catch(() => undefined); // no service worker: the pages still work online
    return () => {
      cancelled = true;
    };
  }, [key]);
}
