// Registers the field pages' service worker (app/public/sw.js) and asks it to keep copies of the
// pages this contractor may need on site: the list, each selection's form (with its curve data,
// which is in the page) and the scripts and styles they load. Answers true once they are kept.
import { useEffect, useState } from "react";

export function useOfflineCopies(paths: string[]): boolean {
  const key = paths.join(" ");
  const [kept, setKept] = useState(false);
  useEffect(() => {
    if (!("serviceWorker" in navigator) || !key) return;
    let cancelled = false;
    const onMessage = (event: MessageEvent) => {
      if (event.data?.type === "kept" && event.data.key === key && !cancelled) setKept(true);
    };
    navigator.serviceWorker.addEventListener("message", onMessage);
    navigator.serviceWorker
      .register("/sw.js", { scope: "/" })
      .then(() => navigator.serviceWorker.ready)
      .then((registration) => {
        if (cancelled) return;
        const assets = [...document.querySelectorAll<HTMLScriptElement | HTMLLinkElement>("script[src], link[rel=modulepreload], link[rel=stylesheet], link[rel=manifest], link[rel=icon]")]
          .map((el) => ("src" in el && el.src ? el.src : (el as HTMLLinkElement).href))
          .filter(Boolean);
        registration.active?.postMessage({ type: "keep", key, pages: key.split(" "), assets });
      })
      .catch(() => undefined); // no service worker: the pages still work online
    return () => {
      cancelled = true;
      navigator.serviceWorker.removeEventListener("message", onMessage);
    };
  }, [key]);
  return kept;
}

/** Says (politely) when the pages are kept on the phone for use without a network. */
export function OfflineReady({ kept }: { kept: boolean }) {
  return (
    <p role="status" className="text-sm text-slate-700" data-testid="offline-ready">
      {kept ? "Kept on this phone: these pages open without a network." : ""}
    </p>
  );
}
