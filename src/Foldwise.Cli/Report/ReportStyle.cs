namespace Foldwise.Cli.Report;

/// <summary>The page's inline style (system fonts only: nothing is fetched) and its footer of cautions, worded as in the README.</summary>
public static class ReportStyle
{
    public const string Css = """
        body { font-family: system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif; margin: 0; color: #222; background: #f6f6f4; }
        header, main, footer { max-width: 1040px; margin: 0 auto; padding: 0 20px; }
        header { padding-top: 18px; }
        h1 { font-size: 1.5rem; margin: 0.4rem 0; }
        h2.part { font-size: 1.25rem; margin: 1.4rem 0 0.2rem; }
        h3 { font-size: 1.05rem; margin: 0 0 0.3rem; }
        .question { color: #444; margin: 0 0 4px; max-width: 62rem; }
        .facts { color: #555; margin-top: 0; }
        section.chart { background: #fff; border: 1px solid #ddd; border-radius: 6px; padding: 12px 16px; margin: 14px 0; }
        .reading { color: #444; margin: 0 0 8px; max-width: 62rem; }
        figure { margin: 0; overflow-x: auto; }
        figure svg { max-width: 100%; height: auto; }
        figure svg text { font-family: "DejaVu Sans", "Segoe UI", Arial, sans-serif; }
        .grid { display: grid; grid-template-columns: repeat(auto-fill, minmax(300px, 1fr)); gap: 10px; background: #fff; border: 1px solid #ddd; border-radius: 6px; padding: 12px; margin: 14px 0; }
        .grid section.chart { margin: 0; border: 1px solid #eee; padding: 8px; }
        .grid .reading { font-size: 0.85rem; }
        .pair { display: flex; gap: 8px; flex-wrap: wrap; }
        .pair svg { flex: 1 1 45%; }
        table.names { border-collapse: collapse; margin-top: 8px; font-size: 0.9rem; }
        table.names td, table.names th { border-bottom: 1px solid #eee; padding: 2px 12px 2px 0; text-align: left; }
        .swatch { display: inline-block; width: 0.8em; height: 0.8em; margin-right: 0.25em; border-radius: 2px; vertical-align: baseline; }
        .empty { color: #777; font-style: italic; }
        footer h2 { font-size: 1.1rem; }
        footer { color: #555; font-size: 0.9rem; padding-bottom: 24px; }
        """;

    public const string Footer = """
        <footer><h2>Cautions</h2><ul>
        <li>A model that scores people — credit, pricing, service levels — needs your organisation's fairness and regulatory review under local rules before use. Foldwise measures accuracy only.</li>
        <li>A cross-validated score is an estimate, not a guarantee: new data can differ from the training table.</li>
        <li>The blend's nested estimate (weights fitted without the fold they are scored on) is the honest figure; the in-sample blend score flatters itself.</li>
        </ul><p>Written by Foldwise from the search's store; this page loads nothing from the network.</p></footer>
        """;
}
