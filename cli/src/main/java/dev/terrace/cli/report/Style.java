package dev.terrace.cli.report;

/**
 * The report's style sheet, inlined in every page: black on white, sized for A4 paper, with page
 * breaks kept out of figures, table rows and headings.
 *
 * @since 0.1
 */
final class Style {

    private Style() {
    }

    /** The CSS text. */
    static final String CSS = String.join("\n",
            "@page { size: A4; margin: 14mm 12mm 16mm 12mm; }",
            "html { background: #fff; color: #000; }",
            "body { font-family: 'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif; font-size: 10pt;",
            "  line-height: 1.35; max-width: 250mm; margin: 0 auto; padding: 8mm 6mm; background: #fff; color: #000; }",
            "h1 { font-size: 17pt; margin: 0 0 2mm 0; }",
            "h2 { font-size: 13pt; margin: 8mm 0 2mm 0; padding-bottom: 1mm; border-bottom: 1.5pt solid #000;",
            "  break-after: avoid; page-break-after: avoid; }",
            "h3 { font-size: 11pt; margin: 4mm 0 1.5mm 0; break-after: avoid; page-break-after: avoid; }",
            "p, li, dd { orphans: 3; widows: 3; }",
            "code { font-family: 'DejaVu Sans Mono', 'Liberation Mono', monospace; font-size: 0.92em; }",
            "a { color: #000; }",
            ".meta { margin: 0 0 2mm 0; }",
            ".note { border-left: 2pt solid #000; padding: 0.5mm 0 0.5mm 3mm; margin: 2mm 0; }",
            ".small, footer { font-size: 8.5pt; }",
            "footer { margin-top: 8mm; border-top: 0.5pt solid #000; padding-top: 2mm; }",
            "nav ol.toc { columns: 2; margin: 2mm 0 4mm 0; padding-left: 6mm; }",
            "table { border-collapse: collapse; width: 100%; margin: 2mm 0 3mm 0; font-size: 8.5pt; }",
            "table.facts { width: auto; }",
            "table.facts th { text-align: left; padding-right: 4mm; font-weight: bold; border: none; }",
            "table.facts td { border: none; }",
            "table.grid th, table.grid td { border: 0.5pt solid #000; padding: 0.6mm 1.2mm; text-align: left;",
            "  vertical-align: top; }",
            "table.grid thead th { border-bottom: 1.5pt solid #000; font-weight: bold; }",
            "table.runs { font-size: 7.5pt; }",
            "table.scores td:first-child { width: 45%; }",
            "table.runs code { font-size: 1em; }",
            "thead { display: table-header-group; }",
            "tr { break-inside: avoid; page-break-inside: avoid; }",
            "td.n { text-align: right; white-space: nowrap; font-variant-numeric: tabular-nums; }",
            "td.source { font-size: 0.95em; }",
            ".date { font-weight: normal; font-size: 0.9em; white-space: nowrap; }",
            "td.failed-note { font-style: italic; }",
            "table.params col.c-name { width: 17%; } table.params col.c-value { width: 12%; }",
            "table.params col.c-interval { width: 17%; } table.params col.c-how { width: 27%; }",
            "table.params col.c-source { width: 27%; }",
            "table.notes { width: auto; font-size: 8.5pt; }",
            "table.notes th { text-align: left; padding: 0 3mm 0 0; vertical-align: top; }",
            "table.notes td { padding: 0; }",
            "tr.failed td, tr.failed th { font-style: italic; }",
            "tr.held .status { font-style: italic; }",
            ".unit { font-weight: normal; font-size: 0.9em; }",
            ".mark { white-space: nowrap; }",
            ".mark.met { font-weight: bold; }",
            ".mark.missed { font-weight: normal; }",
            ".mark.unmeasured { font-style: italic; }",
            "figure { margin: 2mm 0 4mm 0; break-inside: avoid; page-break-inside: avoid; }",
            "figure svg { display: block; width: 100%; height: auto; }",
            "figcaption { font-size: 8.5pt; margin-top: 1mm; }",
            "div.grid2 { display: flex; flex-wrap: wrap; gap: 4mm; }",
            "div.grid2 > figure { flex: 1 1 84mm; min-width: 70mm; }",
            "div.single > figure { max-width: 170mm; }",
            "div.proposal { break-inside: avoid; page-break-inside: avoid; }",
            "dl.meaning dt { font-weight: bold; }",
            "dl.meaning dd { margin: 0 0 1.5mm 6mm; }",
            "ul.cautions li { margin-bottom: 1mm; }",
            ".defer { font-weight: bold; }",
            "@media print {",
            "  body { padding: 0; max-width: none; }",
            "  nav { display: none; }",
            "  section.break { break-before: page; page-break-before: always; }",
            "}",
            "");
}
