/**
 * The report page's style sheet: a single centred column, system fonts,
 * tabular figures in tables, clear pass/fail colours from the Okabe & Ito
 * (2008) palette (bluish green and vermillion, told apart by mark and word
 * too, not by colour alone), and print rules that keep figures and tables
 * whole on a page.
 */
export const REPORT_STYLE = `
:root { color-scheme: light; --ink: #1b1b1b; --muted: #5c5c5c; --rule: #d9d9d9; --panel: #f6f6f4; --pass: #007a5a; --fail: #b84a00; }
* { box-sizing: border-box; }
html { background: #ffffff; color: var(--ink); }
body { margin: 0 auto; max-width: 62rem; padding: 1.5rem 1.25rem 3rem; font: 15px/1.5 system-ui, -apple-system, 'Segoe UI', 'Helvetica Neue', Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif; }
header { border-bottom: 2px solid var(--ink); padding-bottom: 0.6rem; margin-bottom: 1.2rem; }
h1 { font-size: 1.55rem; margin: 0 0 0.35rem; font-weight: 650; letter-spacing: -0.01em; }
h2 { font-size: 1.1rem; margin: 2rem 0 0.6rem; padding-bottom: 0.2rem; border-bottom: 1px solid var(--rule); font-weight: 650; }
h3 { font-size: 0.98rem; margin: 1.2rem 0 0.4rem; font-weight: 600; }
.verdict { display: inline-block; margin: 0.2rem 0 0; padding: 0.15rem 0.6rem; border-radius: 3px; font-weight: 600; border: 1px solid currentColor; }
.verdict.pass, .mark.pass { color: var(--pass); }
.verdict.fail, .mark.fail { color: var(--fail); }
.facts { display: grid; grid-template-columns: max-content 1fr; gap: 0.2rem 1.2rem; margin: 0; }
.facts dt { color: var(--muted); }
.facts dd { margin: 0; font-variant-numeric: tabular-nums; }
.warnings { background: #fff6e5; border-left: 3px solid var(--fail); padding: 0.5rem 0.9rem; margin: 1rem 0; }
.warnings ul { margin: 0.2rem 0 0; padding-left: 1.2rem; }
table { border-collapse: collapse; width: auto; min-width: 50%; font-variant-numeric: tabular-nums; margin: 0.4rem 0; }
th, td { padding: 0.28rem 0.8rem; text-align: left; border-bottom: 1px solid var(--rule); vertical-align: baseline; }
thead th { border-bottom: 1.5px solid var(--ink); font-weight: 600; }
tbody th { font-weight: 500; white-space: nowrap; }
td.number, th.number { text-align: right; white-space: nowrap; }
th .name, td .name { color: var(--muted); font-size: 0.8em; margin-left: 0.4em; font-family: ui-monospace, 'DejaVu Sans Mono', 'Liberation Mono', monospace; }
th .qualifier { display: block; color: var(--muted); font-size: 0.78em; font-weight: normal; }
.resolved { color: var(--muted); font-size: 0.85em; }
.warnings code { font-size: 0.85em; margin-right: 0.3em; }
.mark { font-weight: 700; margin-right: 0.25em; }
.note { color: var(--muted); font-size: 0.88rem; margin: 0.3rem 0 0; }
figure { margin: 1.2rem 0 1.8rem; padding: 0.6rem; background: #ffffff; border: 1px solid var(--rule); }
figure svg { display: block; max-width: 100%; height: auto; margin: 0 auto; }
figcaption { color: var(--muted); font-size: 0.9rem; margin-top: 0.5rem; }
figcaption strong { color: var(--ink); }
pre { background: var(--panel); border: 1px solid var(--rule); padding: 0.8rem 1rem; overflow-x: auto; font: 13px/1.45 ui-monospace, 'DejaVu Sans Mono', 'Liberation Mono', Menlo, Consolas, monospace; white-space: pre; }
code, .digest { font-family: ui-monospace, 'DejaVu Sans Mono', 'Liberation Mono', Menlo, Consolas, monospace; font-size: 0.85em; }
.digest { word-break: break-all; }
footer { margin-top: 2.5rem; padding-top: 0.6rem; border-top: 1px solid var(--rule); color: var(--muted); font-size: 0.85rem; }
@media print {
  body { max-width: none; padding: 0; font-size: 10.5pt; }
  figure, table, pre { break-inside: avoid; }
  h2 { break-after: avoid; }
  pre { white-space: pre-wrap; }
}
`;
