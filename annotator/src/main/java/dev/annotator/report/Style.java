package dev.annotator.report;

/** The report's inline style sheet and its one script (sorting the records table by a clicked column). */
final class Style {
    private Style() {
    }

    static final String CSS = """
            body { font-family: sans-serif; margin: 1.5em; color: #222; max-width: 1100px; }
            table { border-collapse: collapse; margin: 0.5em 0; }
            th, td { border: 1px solid #bbb; padding: 2px 6px; text-align: right; font-size: 0.9em; }
            th { background: #eee; }
            table.run th, table.run td, td:first-child { text-align: left; }
            table.sortable thead th { cursor: pointer; }
            tr.flagged td:last-child { font-weight: bold; }
            .caution { border: 2px solid #D55E00; padding: 0.5em; font-weight: bold; }
            svg { display: block; margin-bottom: 1em; }
            svg text { font-size: 11px; font-family: sans-serif; }
            @media print { table.sortable thead th { cursor: auto; } h3 { page-break-after: avoid; } }
            """;

    // sorts numerically when both cells read as numbers, else as text; a second click reverses
    static final String SORT_SCRIPT = """
            document.querySelectorAll('table.sortable').forEach(function (table) {
              table.querySelectorAll('thead th').forEach(function (th, col) {
                th.addEventListener('click', function () {
                  var body = table.tBodies[0];
                  var rows = Array.prototype.slice.call(body.rows);
                  var dir = th.getAttribute('data-dir') === 'asc' ? -1 : 1;
                  th.setAttribute('data-dir', dir === 1 ? 'asc' : 'desc');
                  rows.sort(function (a, b) {
                    var x = a.cells[col].textContent, y = b.cells[col].textContent;
                    var nx = parseFloat(x), ny = parseFloat(y);
                    if (!isNaN(nx) && !isNaN(ny)) { return dir * (nx - ny); }
                    return dir * x.localeCompare(y);
                  });
                  rows.forEach(function (r) { body.appendChild(r); });
                });
              });
            });
            """;
}
