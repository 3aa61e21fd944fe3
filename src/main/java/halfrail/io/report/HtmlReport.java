package halfrail.io.report;

import halfrail.check.Finding;

import java.util.Base64;
import java.util.List;
import java.util.Locale;

/**
 * Writes a review as one self-contained XHTML file: inline style, pictures embedded as
 * {@code data:} URIs, no scripts and nothing fetched. The markup is well-formed XML (it parses
 * as XHTML), so other tools can read it too.
 */
public final class HtmlReport {
    /** Marks a finding's code on its list item: {@code data-code="BIAS_AMPLIFIED"}. */
    public static final String CODE_ATTRIBUTE = "data-code";
    /** Marks a stage's table with the stage's label. */
    public static final String STAGE_ATTRIBUTE = "data-stage";

    private static final String STYLE = String.join("\n",
            "body{margin:0;background:#fbfaf7;color:#22303c;font:15px/1.45 'DejaVu Sans',system-ui,sans-serif}",
            "main{max-width:980px;margin:0 auto;padding:28px 32px 64px}",
            "h1{font-size:26px;margin:0 0 4px;letter-spacing:.01em}",
            "h2{font-size:21px;margin:44px 0 2px;padding-top:14px;border-top:3px solid #22303c}",
            "h3{font-size:16px;margin:26px 0 8px;color:#1f4e8c}",
            "p.meta{color:#6b7a89;margin:0 0 14px;font-size:13px}",
            "p.safety{border-left:5px solid #e08a1e;background:#fdf3e4;padding:8px 12px;font-size:13.5px}",
            "p.problem{border-left:5px solid #c8324b;background:#fbe9ec;padding:8px 12px}",
            "table{border-collapse:collapse;margin:6px 0 14px;font-size:13.5px;min-width:60%}",
            "caption{text-align:left;font-weight:bold;padding:4px 0}",
            "th,td{padding:4px 10px;border-bottom:1px solid #e6e3dd;text-align:left;vertical-align:top}",
            "thead th{background:#22303c;color:#fff;font-weight:600}",
            "table.pairs td:first-child{color:#6b7a89;width:42%}",
            ".verdict{display:inline-block;min-width:3.2em;text-align:center;border-radius:9px;padding:0 8px;"
                    + "color:#fff;font-weight:bold;font-size:12px}",
            ".v-fail{background:#c8324b}.v-warn{background:#e08a1e}.v-pass{background:#3c8d5a}",
            "figure{margin:10px 0 18px}figure img{max-width:100%;border:1px solid #e6e3dd}",
            "figcaption{color:#6b7a89;font-size:13px}",
            "ol.findings{list-style:none;padding:0}",
            "li.finding{border-left:6px solid #8a96a3;background:#fff;margin:0 0 10px;padding:8px 12px}",
            "li.finding.fail{border-color:#c8324b}li.finding.warn{border-color:#e08a1e}li.finding.note{border-color:#3c8d93}",
            "li.finding p{margin:3px 0}p.suggestion{color:#1f4e8c}p.parts{color:#6b7a89;font-size:12.5px}",
            "a{color:#1f4e8c}",
            "code{font:12.5px 'DejaVu Sans Mono',monospace;background:#eeebe5;padding:0 4px;border-radius:3px}",
            "footer{margin-top:40px;color:#6b7a89;font-size:12px}");

    private HtmlReport() {}

    /** The review as an XHTML document. */
    public static String render(Review review) {
        List<Block> blocks = ReviewDocument.blocks(review);
        StringBuilder h = new StringBuilder(1 << 16);
        h.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<!DOCTYPE html>\n");
        h.append("<html xmlns=\"http://www.w3.org/1999/xhtml\" lang=\"en\" xml:lang=\"en\">\n<head>\n");
        h.append("<meta charset=\"UTF-8\"/>\n<meta name=\"generator\" content=\"halfrail ")
                .append(esc(review.toolVersion())).append("\"/>\n");
        h.append("<title>").append(esc(title(review))).append("</title>\n<style>\n").append(STYLE)
                .append("\n</style>\n</head>\n<body>\n<main>\n");
        boolean inFindings = false;
        String section = null;
        for (Block b : blocks) {
            if (!(b instanceof Block.FindingItem) && inFindings) {
                h.append("</ol>\n");
                inFindings = false;
            }
            if (b instanceof Block.Heading x) {
                if (x.level() == 2) {
                    if (section != null) {
                        h.append("</section>\n");
                    }
                    section = x.id();
                    h.append("<section id=\"").append(esc(x.id())).append("\" class=\"")
                            .append(x.id().equals("summary") ? "summary" : "design").append("\">\n");
                }
                h.append("<h").append(x.level()).append(" id=\"").append(esc(x.id())).append("-h\">")
                        .append(esc(x.text())).append("</h").append(x.level()).append(">\n");
            } else if (b instanceof Block.Para p) {
                h.append("<p class=\"").append(p.kind().name().toLowerCase(Locale.ROOT)).append("\">")
                        .append(esc(p.text())).append("</p>\n");
            } else if (b instanceof Block.Table t) {
                table(h, t);
            } else if (b instanceof Block.Picture p) {
                h.append("<figure id=\"").append(esc(p.id())).append("\"><img alt=\"").append(esc(p.alt()))
                        .append("\" width=\"").append(p.image().getWidth()).append("\" src=\"data:image/png;base64,")
                        .append(Base64.getEncoder().encodeToString(ReportPictures.png(p.image())))
                        .append("\"/><figcaption>").append(esc(p.caption())).append("</figcaption></figure>\n");
            } else if (b instanceof Block.FindingItem fi) {
                if (!inFindings) {
                    h.append("<ol class=\"findings\">\n");
                    inFindings = true;
                }
                finding(h, fi.finding());
            }
        }
        if (inFindings) {
            h.append("</ol>\n");
        }
        if (section != null) {
            h.append("</section>\n");
        }
        h.append("<footer>Made by halfrail ").append(esc(review.toolVersion())).append(" on ")
                .append(esc(ReviewDocument.WHEN.format(review.generated())))
                .append(". The figures come from solving the circuit models; check them against the parts'"
                        + " data and a prototype before you rely on them.</footer>\n");
        h.append("</main>\n</body>\n</html>\n");
        return h.toString();
    }

    static String title(Review review) {
        if (review.size() == 1) {
            return ReviewDocument.TITLE + ": " + (review.entries().isEmpty() ? review.netlists().get(0).name()
                    : review.entries().get(0).report().design().name());
        }
        return ReviewDocument.TITLE + ": " + ReviewDocument.count(review);
    }

    private static void table(StringBuilder h, Block.Table t) {
        boolean pairs = t.header().isEmpty();
        h.append("<table id=\"").append(esc(t.id())).append("\"").append(pairs ? " class=\"pairs\"" : "");
        if (t.id().contains("-stage-")) {
            h.append(" ").append(STAGE_ATTRIBUTE).append("=\"").append(esc(t.caption().substring("Stage ".length())))
                    .append("\"");
        }
        h.append(">\n<caption>").append(esc(t.caption())).append("</caption>\n");
        if (!pairs) {
            h.append("<thead><tr>");
            for (String c : t.header()) {
                h.append("<th>").append(esc(c)).append("</th>");
            }
            h.append("</tr></thead>\n");
        }
        h.append("<tbody>\n");
        for (int r = 0; r < t.rows().size(); r++) {
            List<String> row = t.rows().get(r);
            h.append("<tr>");
            for (int c = 0; c < row.size(); c++) {
                h.append("<td>");
                if (c == 0 && !t.links().isEmpty()) {
                    h.append("<a href=\"#").append(esc(t.links().get(r))).append("\">").append(esc(row.get(c)))
                            .append("</a>");
                } else if (c == t.verdictColumn() && !t.verdicts().isEmpty()) {
                    h.append("<span class=\"verdict v-").append(t.verdicts().get(r).word()).append("\">")
                            .append(esc(row.get(c))).append("</span>");
                } else {
                    h.append(esc(row.get(c)));
                }
                h.append("</td>");
            }
            h.append("</tr>\n");
        }
        h.append("</tbody>\n</table>\n");
    }

    private static void finding(StringBuilder h, Finding f) {
        String sev = ReviewDocument.severity(f);
        h.append("<li class=\"finding ").append(sev).append("\" ").append(CODE_ATTRIBUTE).append("=\"")
                .append(esc(f.code())).append("\">");
        h.append("<p><span class=\"verdict v-").append(Verdict.of(f.severity()).word()).append("\">").append(sev)
                .append("</span> <code>").append(esc(f.code())).append("</code>");
        f.opAmp().ifPresent(o -> h.append(" \u00B7 ").append(esc(o)));
        h.append("</p>");
        h.append("<p class=\"message\">").append(esc(f.message())).append("</p>");
        if (!f.suggestion().isBlank()) {
            h.append("<p class=\"suggestion\">Suggestion: ").append(esc(f.suggestion())).append("</p>");
        }
        if (!f.parts().isEmpty()) {
            h.append("<p class=\"parts\">parts: ").append(esc(String.join(", ", f.parts()))).append("</p>");
        }
        h.append("</li>\n");
    }

    /** Escape for XML text and attribute values; drops characters XML 1.0 does not allow. */
    static String esc(String s) {
        StringBuilder b = new StringBuilder(s.length() + 16);
        s.codePoints().forEach(cp -> {
            switch (cp) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> {
                    boolean allowed = cp == 0x9 || cp == 0xA || cp == 0xD || (cp >= 0x20 && cp <= 0xD7FF)
                            || (cp >= 0xE000 && cp <= 0xFFFD) || cp >= 0x10000;
                    if (allowed) {
                        b.appendCodePoint(cp);
                    }
                }
            }
        });
        return b.toString();
    }
}
