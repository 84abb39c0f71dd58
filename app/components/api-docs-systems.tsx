// The /api page's section on the systems read API (GET /api/v1/systems/:id and …/search).
import { DocTable } from "./DocTable";
import { SEARCH_FILL_JUDGED } from "~/lib/projects/search-fill";
import { SEARCH_DEFAULT_PUMPS, SEARCH_MAX_PUMPS, SEARCH_MIN_PUMPS } from "~/lib/projects/search-arrangement";

const VERDICTS: [string, string][] = [
  ["meets", "The operating flow is within the duty's tolerance (by default 0 % below / +10 % above the duty flow; settable per system)."],
  ["short", "The pump delivers less than the duty flow on this system."],
  ["oversized", "The pump delivers more than the tolerance above the duty flow; the reasons say what throttling, trim or speed would save."],
  ["outside-catalogue", "The trim or speed needed lies outside what the model publishes (smallest to largest impeller; speed 30–100 % of rated unless the model says otherwise)."],
  ["no-operating-point", "The pump and system curves do not meet; the reasons say why (shut-off head below the static head, curve ends before the system curve, …)."],
  ["viscosity-uncorrected", "The liquid is more viscous than the water the curve was measured on (ANSI/HI 9.6.7 parameter B above 1) and the curve could not be corrected for it: B above 40, outside the method, or a curve without efficiency (no BEP to correct from). Where the water curve would meet the duty or be oversized it cannot be signed off as is; the reasons give B and the water curve's result. A short pump stays short. With B from 1 to 40 the curve is corrected and the verdict is one of the above, judged on the corrected curve: its rule and first reason give B, C_Q, C_H at the BEP and C_η."],
];

const SYSTEM_FIELDS: [string, string][] = [
  ["system", "id, name, projectId, projectName"],
  ["input", "the stored system inputs (the same document the editor saves and POST …/preview takes)"],
  ["evaluation", "system curve: flows (m³/s), design / low / high head (m) over the band, pressure (Pa), per-run figures at the duty flow, NPSHa (m), warnings; null with systemError when the inputs cannot be evaluated"],
  ["flowMax", "upper end of the evaluated flow range, m³/s"],
  ["candidates[]", "id, curveSetId, label, library, adjustment (method none/speed/trim, ratio, arrangement, pumps), result (ratio: the speed or trim ratio every figure is at — typed, or solved to the duty and rounded up to the next whole rpm or whole mm, as a site sets it and the page shows it; solvedRatio: the ratio solved before that rounding, null when none was solved; ratioNote says both in words; operating point, curve, figures, band (each edge of the system band), npsh (NPSH over the band, null without it: { status (ok, low-margin, cavitation-risk, unknown), marginRatio (the lowest NPSHa / NPSHr, the one that decides), at (where), available (NPSHa there, m), rule, requiredMargin (the system's wanted NPSHa / NPSHr), judgedAt [{ at, flow (m³/s), pumpFlow (one pump's flow on its curve, m³/s), available (NPSHa, m), required (NPSHr, m), marginRatio }] (the design point first, then each corner), unjudged [{ at, why }] (the points the rule names that could not be judged, which leave the status unknown), npshrPublished: the NPSHr one pump's curve publishes, as run (moved by the speed or trim ratio as the curve is), null where it publishes none, else { from, to (its first and last flow with an NPSHr, m³/s), points (how many carry one), single (with one point only, its NPSHr in m, judged nowhere: one point is no curve; else null), pumps (pumps running together), column [{ flow (m³/s), npshr (m) }] (the published points themselves, which NPSHr is read between and never beyond; absent in results from before it was kept) } }), warnings, result.verdict { status, rule, reasons }, result.verdictNpsh (what NPSH over the band says against the verdict, as in the search results below, or null), result.verdictStart (what starting pumps in parallel one after another says against the verdict, as in the search results below, or null), result.verdictMotor (what the motor check says against the verdict on its line: \"but the motor is overloaded at the operating point: one pump takes 6.3 kW, above motor rating × service factor 5.5 kW\", or \"but the motor can overload: largest power on the curve … exceeds motor rating × service factor …\"; \"and\" after a verdict other than meets; null when the motor is within its limit, not judged, or no motor is set), result.verdictStagedNpsh (what NPSH at a duty-cycle step of pumps in parallel staged by demand, where fewer run, says against the verdict: \"but at a duty-cycle step with fewer pumps running (staged by demand): NPSH at 40 % flow, 1 of 2 pumps running: … NPSHa … / NPSHr … = 0.95, below 1 …: cavitation risk (common practice: …)\"; null when every such step keeps the wanted margin), result.verdictMinFlow (a duty below the maker's minimum continuous flow of the curve set, on the verdict's line: \"but runs below the maker's minimum flow: 8.0 m³/h < 12.0 m³/h\"; null when the curve set records no figure or the duty each running pump takes is at or above it) with result.minFlow, its numbers: null without a figure, else { published (the maker's figure at the curve's speed and impeller, m³/s), method and ratio (the speed or trim it is scaled by, affinity laws), atPump (one pump's minimum as run, m³/s), dutyFlow (m³/s), running (pumps sharing the duty), dutyPerPump (m³/s), below }, with result.stagedStart, the numbers behind it: [] or one entry per edge of the band where it leaves the duty unmet, { at (the edge), running (pumps running), of (duty pumps), heldHead (the head those running hold, m), shutoffHead (one pump's shut-off head, m), flow (what those running deliver, m³/s), dutyFlow (m³/s), leastFlow (duty × (1 − minus), m³/s), minus (the flow tolerance below the duty, 0–1) }, and for a custom liquid result.viscosity { status: corrected / no-correction / outside-method / no-bep / not-checked, b, factors { flow, head, efficiency } }: with corrected, the curve and every figure are on the curve corrected per ANSI/HI 9.6.7), error. NPSH margin ratios (figures.npshMarginRatio, band[].npshMarginRatio, npsh.judgedAt[].marginRatio) are null where NPSHa is at or below zero: a ratio NPSHa / NPSHr there means nothing, NPSHa beside it decides (cavitation risk whatever the pump's NPSHr), as the selection CSV leaves it blank"],
  ["needsReview[]", "candidates whose stored adjustment does not pass the checks: id, curveSetId, label, library, count, problems [{ path, label, message, stored }], form (the stored values as far as they read); never evaluated, so not among candidates[]"],
];

const SEARCH_FIELDS: [string, string][] = [
  ["rank, label, model, type, size", "position in the ranking and the pump model's names"],
  ["modelId, curveSetId", "ids of the pump model and of the published curve that was searched"],
  ["library", "name of the library the curve comes from"],
  ["curve", "the published curve: speed (rpm) and impellerDiameter (m)"],
  ["adjustment", "the pump as its verdict judged it (as the candidates table evaluates it): kind: none (as published), speed (affinity laws) or trim (approximate); ratio (speed or diameter ratio, solved to deliver the duty flow against the system's head there at the band's demanding edge); speed (rpm) and diameter (m) after the adjustment; note (how the ratio was found, in words); directRule (the search's direct rule with this result's numbers, in the units asked for: a pump is found direct — as published, kind none — only when its head as published at the duty flow lies within the duty head to duty head × 1.05, each end to 1 part in 10⁸, else trimmed or at another speed; e.g. \"Direct: its head as published at the duty flow 30.0 m³/h is 41.0 m, within the duty head 40 m to duty head × 1.05 = 42 m (each end to 1 part in 10⁸)\" or \"Not direct: … 44.0 m, above …\"; the duty searched is named where it is not the typed duty: one pump's share, a custom liquid's equivalent water duty); arrangement (single, parallel or series), dutyPumps and standbyPumps: the arrangement the verdict judged, as asked (one pump: single, 1, 0)"],
  ["verdict", "{ status, rule, reasons } with a status below, or null when no verdict was computed"],
  ["verdictNpsh", "what NPSH over the band says against the verdict, on the verdict's line wherever Dutymark shows it: a cavitation risk (NPSHa below NPSHr, or NPSHa at or below zero) or an NPSH margin below the system's wanted ratio, in words with NPSHa, NPSHr and where (\"but NPSHa 2.1 m below NPSHr 2.5 m at least lift, aged pipe (NPSHa / NPSHr 0.84, below 1): cavitation risk\"; \"but\" after meets, \"and\" after another verdict); after a verdict that passes (meets, oversized) whose NPSH could not be judged everywhere, \"but NPSH not checked: the NPSHr curve ends at 38.0 m³/h, and the pump runs past it at 41.1 m³/h (design point), …\" with both flows and where (\"starts at …, and the pump runs below it at …\"; one pump's curve and each pump's flow for pumps in parallel or series; \"the curve publishes NPSHr at one flow only (3.20 m at 150 m³/h): one point is no curve to read it at …\" — a single point is judged nowhere; \"the curve publishes no NPSHr at …\" without any); null when NPSH is ok, or unknown after a verdict that is no pass"],
  ["verdictStart", "what starting pumps in parallel one after another (duty/standby staging) says against the verdict, on the verdict's line wherever Dutymark shows it: where a pump cannot open its check valve against the head those running hold (at or above its shut-off head, to 1 part in 10⁸: at equal heads it delivers no flow) and they deliver less than duty × (1 − minus tolerance), in words with both heads, the flow and the duty (\"but started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 41.2 m pump 1 holds (above its shut-off head 40.0 m), so only 1 delivers, 50.8 m³/h, below the duty 54.0 m³/h; the verdict assumes the 2 started together\"; \"but\" after meets, \"and\" after another verdict), or null; for one pump always null (a candidate's result carries it in the systems API above)"],
  ["verdictMinFlow", "a duty below the maker's minimum continuous flow of the curve set, on the verdict's line wherever Dutymark shows it: the duty each running pump takes (the duty ÷ duty pumps in parallel) against the maker's figure, × the speed or trim ratio the pump runs at (affinity laws), in words with both flows (\"but runs below the maker's minimum flow: 8.00 m³/h < 12.0 m³/h\"); null when the curve set records no figure or the duty is at or above it"],
  ["npsh", "NPSH as the workbench judges it, at the design point and each corner of the system's band: { status (ok, low-margin, cavitation-risk, unknown), marginRatio (the lowest NPSHa/NPSHr), at (where), available (NPSHa there, m), rule, unjudged [{ at, why }]: the points the rule names that could not be judged (no operating point; past the NPSHr curve's last flow; before the NPSHr curve's first flow; NPSHr published at one flow only; no NPSHr at that flow), which leave the status unknown }, or null with no verdict; a pump that meets the duty but has a cavitation risk on the band ranks after those that do not"],
  ["figures", "at the operating point of the adjustment above (where it meets the system's design curve), as the candidates table: operatingPoint { flow (m³/s), head (m) } or null, perPump { flow, head } (one pump's share of it: the flow / duty pumps in parallel, the head / duty pumps in series; the operating point itself for one pump) or null, efficiency (0–1), shaftPower (W), shaftPowerPerPump (W), bepRatio (operating flow / BEP flow), inPor; for pumps in parallel or series operatingPoint and shaftPower are the duty pumps' together, efficiency, bepRatio, inPor and shaftPowerPerPump one pump's (identical pumps share the duty equally, common practice); the search's at the typed duty (one pump's share of it for several): headAtDuty (m), npshRequired (m; null where the curve has no NPSHr curve at the duty — a single published point is none), npshMargin (NPSHa/NPSHr at the duty), score"],
  ["atTypedDuty", "the search's own setting and figures at the typed duty, which rank the result (one pump at its share of the duty for several pumps): ratio, speed (rpm), diameter (m), efficiency, shaftPower (W), bepRatio, inPor"],
  ["reason, warnings", "why the result ranks where it does, in words, from the figures at the typed duty (it says so where they differ from adjustment and figures); warnings: first the cautions that qualify the verdict, as the candidates table gives them (no flow at the design point (dead-head), an unstable crossing past the operating point, runout, each band edge's, a pump in parallel or series that cannot start), then the search's own at the typed duty (e.g. trim is approximate), each once"],
];

const FIELD_HEAD = ["field", "meaning (SI units)"];
const FIELD_CELLS = ["font-mono text-xs"];

export function SystemsApiDocs({ Code, pageRows, judged }: { Code: (p: { children: string }) => React.ReactNode; pageRows: number; judged: number }) {
  return (
    <section id="systems" className="panel space-y-3">
      <h2 className="text-xl font-semibold">Systems API (read)</h2>
      <p className="text-sm text-slate-700">
        Token or session as for the account API; needs <code>project.read</code>. A system of another workspace, or
        an id that does not exist, answers 404; an id that is not a number, 400; errors are{" "}
        <code>application/problem+json</code>. A system whose stored inputs no longer pass the checks (saved under an
        older version of them, or changed outside the editor) answers 409 on both reads, with <code>detail</code> naming
        where and <code>errors</code> (<code>{"{ field, message }"}</code>) saying what: nothing is computed from it, and no
        default values stand in, until the inputs are fixed and saved on the system page. All numbers are SI.
      </p>
      <h3 className="font-semibold">GET /api/v1/systems/:id</h3>
      <p className="text-sm text-slate-700">The stored system evaluated with its candidates: the same view as the live preview.</p>
      <DocTable head={FIELD_HEAD} cells={FIELD_CELLS} rows={SYSTEM_FIELDS} />
      <h3 className="font-semibold">GET /api/v1/systems/:id/search[?method=direct&amp;method=trim&amp;method=speed][&amp;arrangement=parallel&amp;pumps=2&amp;standby=1][&amp;page=N]</h3>
      <p className="text-sm text-slate-700">
        Pumps from the libraries open to your workspace that meet the system's stored duty, ranked, {pageRows} a page:{" "}
        <code>{"{ duty, message, stats, npshaAtDuty, npshaNote, hidden, catalogueFilter, paging, links, results: [...] }"}</code>, paged as the <a href="#paging">lists above</a>.
        The search keeps the {judged} best distinct curves at most, so <code>paging.total</code> is at most {judged}; a page is a
        slice of one ranking, so <code>rank</code> runs on across pages. A pump whose verdict is outside the catalogue is hidden
        and fills no place: the search judges on down the ranking until {judged} are kept, the ranking ends or {SEARCH_FILL_JUDGED} are
        judged. <code>hidden</code> counts the pumps hidden as outside the catalogue (<code>outsideCatalogue</code>) and the copies of the
        curves judged merged from other libraries (<code>duplicates</code>); <code>catalogueFilter</code>{" "}
        <code>{"{ judged, atMost, kept, places, outsideCatalogue, cut, message }"}</code> says whether the list was cut (fewer than{" "}
        {judged} kept while pumps further down the ranking were left unjudged), with <code>message</code> saying so and why, else null.
        Without <code>page</code> the answer is the first {pageRows} results, as before paging. <code>stats</code> counts the curves searched, <code>rejectedByEnvelope</code> (out of their range),{" "}
        <code>rejectedByNpsh</code> (left out for NPSH at the duty: NPSHa / NPSHr there below 1, i.e. NPSHr above NPSHa where
        NPSHa is above zero; where NPSHa at the duty is at or below zero the search judges it as zero, so every pump with an NPSHr
        there is left out whatever its value) and <code>matched</code>. <code>npshaAtDuty</code> is NPSHa at the duty flow in m,
        the true value (below zero where the suction cannot give any; null without a duty); <code>npshaNote</code>, where it is at
        or below zero, says that no pump can run there without cavitating, whatever its NPSHr, with NPSHa and the pumps left out
        for it (a pump without an NPSHr at the duty is not ruled out by it and is listed, but cavitates there too), the same
        words as the search page; else null. Without a duty,{" "}
        <code>results</code> is empty and <code>message</code> says why; an unknown <code>method</code> is a 400.
        For a custom liquid, <code>liquidSearch</code> says how the water curves were searched (null for water): per pump speed
        in <code>groups[]</code>, <code>{"{ speed, sets, status, b, factors { flow, head, efficiency }, waterDuty { flow, head } }"}</code>.
        With <code>status</code> corrected (ANSI/HI 9.6.7 parameter B from 1 to 40, the duty taken as the BEP) those curves were
        searched at the equivalent water duty Q/C_Q, H/C_H and the results' figures are estimates on the liquid; with
        no-correction (B at most 1), outside-method (B above 40) or no-speed the duty itself was searched on the water curves, as
        before. <code>ranksOnLiquid</code>, <code>rule</code> and <code>message</code> (the same line as the search page) go with it.
      </p>
      <p className="text-sm text-slate-700">
        Pumps in parallel or series, as the search page's arrangement filter: <code>arrangement</code> single (the default),
        parallel or series; <code>pumps</code> the duty pumps, a whole number from {SEARCH_MIN_PUMPS} to {SEARCH_MAX_PUMPS} (default{" "}
        {SEARCH_DEFAULT_PUMPS}); <code>standby</code> the standby pumps, 0 (the default) to <code>pumps</code>, with parallel only (they do
        not run and count in no figure). Each once; an unknown arrangement, a count outside its range or not a whole number, or{" "}
        <code>pumps</code> or <code>standby</code> where they do not apply is a 400 naming the parameter (<code>errors</code>{" "}
        <code>{"[{ field, message }]"}</code>). The engine ranks one pump at its share of the duty — the duty flow / pumps in
        parallel, the duty head / pumps in series, the ranking's approximation (common practice) — and each result's verdict
        judges the pumps' combined curve against the system exactly, as a candidate with that adjustment (staged starts in{" "}
        <code>verdictStart</code>, a pump that cannot start in <code>warnings</code>, the motor per pump). The answer's{" "}
        <code>arrangement</code> <code>{"{ arrangement, dutyPumps, standbyPumps, searchedDuty { flow, head }, rule }"}</code> says
        what was searched (<code>searchedDuty</code>: the share ranked at; <code>rule</code> in words, null for one pump).
        A result added with that adjustment opens with the same verdict.
      </p>
      <DocTable head={FIELD_HEAD} cells={FIELD_CELLS} rows={SEARCH_FIELDS} />
      <h3 className="font-semibold">Verdict statuses</h3>
      <DocTable cells={FIELD_CELLS} rows={VERDICTS} />
      <Code>{`curl -sS https://<your Dutymark address>/api/v1/systems/42/search?method=speed \\
  -H 'Authorization: Bearer <token>'`}</Code>
      <p className="text-xs text-slate-600">
        Results size pumps for design guidance only: confirm with the manufacturer's certified curves, local codes and
        a licensed engineer.
      </p>
    </section>
  );
}
