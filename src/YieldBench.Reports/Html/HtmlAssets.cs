using System.Security.Cryptography;
using System.Text;
using static YieldBench.Reports.Html.HtmlPalette;

namespace YieldBench.Reports.Html;

/// <summary>
/// The page's style sheet and script, written into the page itself, and the content security policy that allows only
/// these two (by their SHA-256) and nothing from anywhere else.
/// </summary>
internal static class HtmlAssets
{
    /// <summary>The style sheet: screen (a projector at 1280×720 included) and print (A4 or Letter, a section per page).</summary>
    public static string Css { get; } = $$"""
:root { color-scheme: light; }
* { box-sizing: border-box; }
html { font-size: 17px; -webkit-text-size-adjust: 100%; }
body { margin: 0; color: {{Ink}}; background: {{Paper}}; font-family: system-ui, "DejaVu Sans", "Segoe UI", Arial, sans-serif; line-height: 1.42; }
.masthead, main, footer { max-width: 1220px; margin: 0 auto; padding-left: 28px; padding-right: 28px; }
.masthead { padding-top: 14px; padding-bottom: 8px; border-bottom: 3px solid {{Accent}}; }
h1 { font-size: 1.45rem; line-height: 1.25; margin: 0 0 2px; }
.facts { margin: 0 0 6px; color: {{Muted}}; }
nav ol { list-style: none; margin: 0; padding: 0; display: flex; flex-wrap: wrap; gap: 2px 20px; font-size: 0.95rem; }
a { color: {{Accent}}; text-underline-offset: 2px; }
a:focus-visible, button:focus-visible, input:focus-visible { outline: 3px solid {{Ink}}; outline-offset: 2px; }
section { padding: 10px 0 12px; border-bottom: 1px solid {{Hairline}}; }
h2 { font-size: 1.45rem; line-height: 1.25; margin: 4px 0 6px; }
h3 { font-size: 1.15rem; margin: 16px 0 4px; }
p { margin: 4px 0 8px; max-width: 72em; }
.lead { font-size: 1.06rem; }
.note { color: {{Muted}}; font-size: 0.92rem; }
.unit { color: {{Muted}}; font-weight: normal; font-size: 0.85em; }
thead .unit { display: block; white-space: nowrap; }
tbody th { white-space: nowrap; }
.scroll { overflow-x: auto; }
table { border-collapse: collapse; width: 100%; margin: 4px 0 10px; font-size: 0.95rem; }
caption { text-align: left; font-weight: 600; padding: 2px 0 4px; }
th, td { padding: 4px 8px; border-bottom: 1px solid {{Hairline}}; vertical-align: top; text-align: left; }
thead th { background: {{HeaderFill}}; vertical-align: bottom; print-color-adjust: exact; -webkit-print-color-adjust: exact; }
tbody tr:nth-child(even) { background: {{Zebra}}; }
table.numbers td, table.numbers thead th { text-align: right; font-variant-numeric: tabular-nums; }
table.numbers td { white-space: nowrap; }
table.numbers thead th:first-child, table.numbers .text { text-align: left; white-space: normal; }
table.planning thead th[scope="colgroup"] { text-align: center; border-left: 2px solid {{Paper}}; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
tr.pooled th, tr.pooled td { font-weight: 700; }
td.factor { font-weight: 700; font-size: 1.08em; }
.formula { white-space: nowrap; }
.severity { display: inline-block; padding: 0 6px; border-radius: 3px; white-space: nowrap; print-color-adjust: exact; -webkit-print-color-adjust: exact; }
.severity.likely-error { background: {{FlaggedFill}}; border-left: 4px solid {{Warm}}; font-weight: 700; }
.severity.check { background: {{HeaderFill}}; }
.severity.note { border: 1px solid {{Hairline}}; }
.aside { display: block; color: {{Muted}}; font-size: 0.9em; margin-top: 2px; }
table.lots td:nth-child(2), table.lots td:nth-child(3), table.lots thead th { white-space: nowrap; }
table.lots td:nth-child(4) { min-width: 18em; }
table.lots td:nth-child(5) { min-width: 12em; }
code { font-family: "DejaVu Sans Mono", Consolas, monospace; font-size: 0.88em; }
code.hash { word-break: break-all; }
figure { margin: 8px 0 10px; break-inside: avoid; }
svg.chart { display: block; width: 100%; height: auto; max-width: 980px; }
figcaption { color: {{Muted}}; font-size: 0.92rem; max-width: 72em; }
ul.methods { padding-left: 1.2em; }
ul.methods li { margin: 4px 0; max-width: 72em; }
ul.cautions { padding-left: 0; list-style: none; }
ul.cautions li { border-left: 4px solid {{Warm}}; padding: 2px 0 2px 12px; margin: 8px 0; max-width: 72em; }
footer { color: {{Muted}}; font-size: 0.9rem; padding-top: 8px; padding-bottom: 24px; }
.filter { margin: 6px 0; }
.filter input { font: inherit; padding: 3px 8px; border: 1px solid {{Muted}}; border-radius: 3px; min-width: 16em; }
.filter output { margin-left: 12px; color: {{Muted}}; }
button.sort { font: inherit; font-weight: inherit; color: inherit; background: none; border: 0; padding: 0; cursor: pointer; text-align: inherit; }
button.sort::after { content: " \2195"; color: {{Muted}}; }
th[aria-sort="ascending"] button.sort::after { content: " \25B2"; }
th[aria-sort="descending"] button.sort::after { content: " \25BC"; }
.print-only { display: none; }
@page { margin: 13mm 12mm; }
@media print {
  tr.unprinted { display: none; }
  .print-only { display: block; font-weight: 700; }
  html { font-size: 9.5pt; }
  .masthead, main, footer { max-width: none; padding-left: 0; padding-right: 0; }
  nav, .filter { display: none; }
  section { border-bottom: 0; }
  section#methods, section#cautions { break-inside: avoid; }
  figure, svg, tr, caption, .lead { break-inside: avoid; }
  h2, h3, caption { break-after: avoid; }
  thead { display: table-header-group; }
  .scroll { overflow: visible; }
  a { color: {{Ink}}; text-decoration: none; }
  svg.chart { max-width: 100%; }
  section#strains svg.chart { max-height: 120mm; width: auto; margin: 0 auto; }
  table.lots { font-size: 0.86rem; table-layout: fixed; }
  table.lots th, table.lots td { padding: 3px 5px; }
  table.lots td { min-width: 0; }
  table.lots th:nth-child(1) { width: 11%; }
  table.lots th:nth-child(2) { width: 8%; }
  table.lots th:nth-child(3) { width: 10%; }
  table.lots th:nth-child(4) { width: 31%; }
  table.lots th:nth-child(5) { width: 21%; }
  table.lots th:nth-child(6) { width: 19%; }
  table.lots .severity { white-space: normal; }
  footer { display: none; }
  button.sort { display: contents; }
  button.sort::after { content: none; }
}

""";

    /// <summary>
    /// The lots table's sort and filter: sort buttons in its header cells and a filter box above it, added only when the
    /// script runs; without it the table is complete and in the page's order.
    /// </summary>
    public static string Script { get; } = """
(function () {
  'use strict';
  var table = document.getElementById('lots-table');
  if (!table || !table.tBodies.length || !table.tHead) { return; }
  var body = table.tBodies[0];
  var rows = Array.prototype.slice.call(body.rows);
  rows.forEach(function (row, i) { row.setAttribute('data-order', String(i)); });

  var box = document.createElement('p');
  box.className = 'filter';
  var label = document.createElement('label');
  label.htmlFor = 'lots-filter';
  label.textContent = 'Show lots containing ';
  var input = document.createElement('input');
  input.type = 'search';
  input.id = 'lots-filter';
  input.autocomplete = 'off';
  var shown = document.createElement('output');
  shown.setAttribute('aria-live', 'polite');
  box.appendChild(label);
  box.appendChild(input);
  box.appendChild(shown);
  table.parentNode.insertBefore(box, table);
  function filter() {
    var query = input.value.trim().toLowerCase();
    var count = 0;
    rows.forEach(function (row) {
      var hit = query === '' || row.textContent.toLowerCase().indexOf(query) >= 0;
      row.hidden = !hit;
      if (hit) { count += 1; }
    });
    shown.textContent = count + ' of ' + rows.length + (rows.length === 1 ? ' lot shown' : ' lots shown');
  }
  input.addEventListener('input', filter);
  filter();

  function key(row, column) {
    var cell = row.cells[column];
    var k = cell.getAttribute('data-key');
    if (k === null) { k = cell.textContent.trim().toLowerCase(); }
    var n = Number(k);
    return k !== '' && !isNaN(n) ? n : k;
  }
  var heads = table.tHead.rows[0].cells;
  Array.prototype.forEach.call(heads, function (th, column) {
    var button = document.createElement('button');
    button.type = 'button';
    button.className = 'sort';
    while (th.firstChild) { button.appendChild(th.firstChild); }
    th.appendChild(button);
    button.addEventListener('click', function () {
      var descending = th.getAttribute('aria-sort') === 'ascending';
      Array.prototype.forEach.call(heads, function (h) { h.removeAttribute('aria-sort'); });
      th.setAttribute('aria-sort', descending ? 'descending' : 'ascending');
      var sign = descending ? -1 : 1;
      rows.sort(function (a, b) {
        var x = key(a, column), y = key(b, column);
        var c = x < y ? -1 : (x > y ? 1 : 0);
        return c !== 0 ? c * sign : Number(a.getAttribute('data-order')) - Number(b.getAttribute('data-order'));
      });
      rows.forEach(function (row) { body.appendChild(row); });
    });
  });
}());

""";

    /// <summary>The page may use its own style sheet and script (by hash) and nothing else: no fetch, no font, no frame.</summary>
    public static string ContentSecurityPolicy { get; } =
        $"default-src 'none'; style-src '{Hash(Css)}'; script-src '{Hash(Script)}'; img-src data:; base-uri 'none'; form-action 'none'";

    private static string Hash(string text) => "sha256-" + Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(text)));
}
