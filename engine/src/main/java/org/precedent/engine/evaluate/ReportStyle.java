package org.precedent.engine.evaluate;

/** The page style, inlined so the report stays one file. */
final class ReportStyle {
  private ReportStyle() {}

  // Calm and print-friendly: warm paper background, one deep blue-green accent, tabular figures for
  // numbers so columns line up, and contrast above 4.5:1 for all text.
  static final String CSS = """
      :root{--ink:#1e2a32;--muted:#56626b;--line:#e4e0d6;--paper:#f6f4ee;--card:#fff;--accent:#26285e;}
      *{box-sizing:border-box}
      body{margin:0;background:var(--paper);color:var(--ink);
        font:15px/1.55 system-ui,-apple-system,"Segoe UI","Noto Sans",Roboto,sans-serif}
      main{max-width:1160px;margin:0 auto;padding:28px 28px 40px}
      header{padding:8px 0 18px;border-bottom:3px solid var(--accent);margin-bottom:8px}
      .kicker{margin:0;color:var(--accent);font-weight:600;letter-spacing:.06em;text-transform:uppercase;font-size:12px}
      h1{margin:2px 0 14px;font-size:28px;font-weight:650;letter-spacing:-.01em}
      .facts{display:flex;flex-wrap:wrap;gap:10px 28px;margin:0}
      .facts div{min-width:110px}
      .facts dt{font-size:12px;color:var(--muted);text-transform:uppercase;letter-spacing:.04em}
      .facts dd{margin:0;font-size:20px;font-weight:600;font-variant-numeric:tabular-nums}
      section{background:var(--card);border:1px solid var(--line);border-radius:6px;padding:18px 24px 20px;margin:20px 0}
      h2{margin:0 0 10px;font-size:19px;color:var(--accent)}
      h3{margin:14px 0 6px;font-size:16px}
      .lead{margin:0 0 14px;color:var(--muted);max-width:80ch}
      .hint{color:var(--muted);font-size:13px;font-weight:400}
      table{border-collapse:collapse;width:100%;font-variant-numeric:tabular-nums;font-size:14px}
      th,td{padding:5px 10px;border-bottom:1px solid var(--line);text-align:right;vertical-align:top}
      td{white-space:nowrap}
      .scroll{overflow-x:auto}
      table.thresholds,table.categories{font-size:13px}
      table.thresholds th,table.thresholds td,table.categories th,table.categories td{padding:4px 7px}
      table.thresholds thead th:first-child{min-width:7.5em}
      th[scope=row],tr.group th{text-align:left;font-weight:500}
      table.categories th[scope=row]{min-width:8em}
      thead th{background:#efece4;font-weight:600;text-align:right}
      thead th:first-child{text-align:left}
      th.system{text-align:center}
      tr.group th{background:#faf8f3;font-size:12px;text-transform:uppercase;letter-spacing:.05em;color:var(--muted);padding-top:10px}
      .first{border-left:1px solid var(--line)}
      td.best{background:#ebebf6}
      td.best strong{color:#1b1d36}
      .interval{color:var(--muted);font-size:13px}
      .swatch{display:inline-block;width:20px;border-top:3px solid;vertical-align:middle;margin-right:7px}
      .advice{border-left:5px solid var(--accent);background:#fbfaf7;padding:8px 16px 10px;margin:10px 0;border-radius:0 4px 4px 0}
      .advice h3{margin:2px 0 4px}
      .advice p{margin:2px 0}
      .headline{font-size:16px}
      .advice.none .headline{font-weight:600}
      .detail{color:var(--muted);font-size:14px}
      .basis{margin:0 0 12px;padding-left:20px;font-size:14px}
      .figures{display:grid;grid-template-columns:repeat(auto-fill,minmax(300px,1fr));gap:12px 20px}
      figure{margin:0;text-align:center}
      figcaption{font-size:14px;margin-top:2px}
      svg.chart{width:100%;height:auto;display:block}
      svg.reliability{width:100%;max-width:330px;height:auto}
      svg text{font-family:inherit}
      .tick{font-size:12px;fill:var(--muted)}
      .label{font-size:13px;fill:#33414a}
      .middle{text-anchor:middle}
      .end{text-anchor:end}
      .grid{stroke:#ecebe5;stroke-width:1}
      .axis{stroke:#7f8a92;stroke-width:1.2}
      .target{stroke:#8b5e1a;stroke-width:1.2;stroke-dasharray:6 4}
      .note{font-size:12px;fill:#7a5216}
      .diagonal{stroke:#56626b;stroke-width:1.2;stroke-dasharray:4 4}
      .legend{font-size:13px;fill:var(--ink)}
      .legend-head{font-size:12px;font-weight:600;fill:var(--muted);text-transform:uppercase;letter-spacing:.05em}
      table.changes{max-width:760px}
      table.changes th[scope=row],table.changes thead th:first-child{width:50%}
      .better{color:#1c6b3c}
      .worse{color:#a2321a}
      .same{color:var(--muted)}
      .verdict{font-size:12px;text-transform:uppercase;letter-spacing:.04em}
      .warn{background:#fbf1dd;border:1px solid #ecd5a6;padding:6px 10px;border-radius:4px}
      footer{margin-top:24px;border-top:1px solid var(--line);padding-top:10px}
      .footnote{font-size:13px;color:var(--muted);margin:4px 0}
      @media print{body{background:#fff}section{break-inside:avoid;border-color:#ccc}}
      """;
}
