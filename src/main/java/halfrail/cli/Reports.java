package halfrail.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.check.Finding;
import halfrail.check.Severity;

import java.util.List;
import java.util.Locale;
import java.util.Map;

/** Renders {@code check} outcomes as text, Markdown or JSON. */
final class Reports {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private Reports() {}

    static String text(List<CheckCommand.Outcome> outcomes) {
        StringBuilder b = new StringBuilder();
        for (CheckCommand.Outcome o : outcomes) {
            if (o.report() == null) {
                continue;
            }
            FileReport r = o.report();
            b.append(r.file());
            if (!r.title().isEmpty()) {
                b.append(" — ").append(r.title());
            }
            b.append('\n');
            b.append("  DC operating point:\n");
            int width = r.nodeVolts().keySet().stream().mapToInt(String::length).max().orElse(4);
            for (Map.Entry<String, Double> e : r.nodeVolts().entrySet()) {
                b.append("    ").append(pad(e.getKey(), width)).append("  ").append(volts(e.getValue()));
                if (r.outputNode().filter(e.getKey()::equals).isPresent()) {
                    b.append("   (output)");
                }
                b.append('\n');
            }
            if (!r.opAmps().isEmpty()) {
                b.append("  op-amps:\n");
                for (OpAmpRow s : r.opAmps()) {
                    b.append(String.format(Locale.ROOT,
                            "    %s  out %s  in+ %s  in- %s  swing %.3f..%.3f V  common mode %.3f..%.3f V  %s, %s%n",
                            s.name(), volts(s.output()), volts(s.inPlus()), volts(s.inMinus()),
                            s.swingLow(), s.swingHigh(), s.commonModeLow(), s.commonModeHigh(),
                            s.saturated() ? "SATURATED" : "linear",
                            s.commonModeOk() ? "inputs in range" : "INPUT OUT OF RANGE"));
                }
            }
            b.append("  floating nodes: ").append(r.floating().isEmpty() ? "none" : String.join(", ", r.floating()))
                    .append('\n');
            b.append("  lower corner: ").append(r.lowerCornerHz() == null ? "none found"
                    : String.format(Locale.ROOT, "%.4g Hz", r.lowerCornerHz())).append('\n');
            b.append("  settle-up: ").append(r.settleSeconds() != null
                    ? String.format(Locale.ROOT, "%.4g s", r.settleSeconds())
                    : r.oscillation().map(w -> String.format(Locale.ROOT,
                    "keeps oscillating at %s (period %.4g s, %.4g V peak to peak)", w.node(), w.periodSeconds(),
                    w.peakToPeakVolts())).orElse("not settled or not run")).append('\n');
            if (r.findings().isEmpty()) {
                b.append("  findings: none\n");
            } else {
                b.append("  findings:\n");
                for (Finding f : r.findings()) {
                    b.append("    ").append(f.severity().name()).append(' ').append(f.code());
                    if (!f.parts().isEmpty()) {
                        b.append(" [").append(String.join(", ", f.parts())).append(']');
                    }
                    b.append(": ").append(f.message()).append('\n');
                    if (!f.suggestion().isEmpty()) {
                        b.append("      suggestion: ").append(f.suggestion()).append('\n');
                    }
                }
            }
            for (String n : r.notes()) {
                b.append("  note: ").append(n).append('\n');
            }
            b.append("  verdict: ").append(r.verdict()).append("\n\n");
        }
        if (outcomes.size() > 1) {
            Map<String, Long> counts = new java.util.TreeMap<>();
            for (CheckCommand.Outcome o : outcomes) {
                counts.merge(o.report() == null ? "bad input" : o.report().verdict(), 1L, Long::sum);
            }
            StringBuilder summary = new StringBuilder();
            counts.forEach((k, v) -> summary.append(summary.length() == 0 ? "" : ", ").append(v).append(' ').append(k));
            b.append(outcomes.size()).append(" files: ").append(summary).append('\n');
        }
        return b.toString();
    }

    static String markdown(List<CheckCommand.Outcome> outcomes) {
        StringBuilder b = new StringBuilder();
        for (CheckCommand.Outcome o : outcomes) {
            b.append("## ").append(md(o.file())).append("\n\n");
            if (o.report() == null) {
                b.append("Not checked: ").append(md(o.error())).append("\n\n");
                continue;
            }
            FileReport r = o.report();
            if (!r.title().isEmpty()) {
                b.append(md(r.title())).append("\n\n");
            }
            b.append("**Verdict:** ").append(r.verdict()).append("\n\n");
            b.append("| node | DC (V) |\n|---|---:|\n");
            for (Map.Entry<String, Double> e : r.nodeVolts().entrySet()) {
                String name = md(e.getKey()) + (r.outputNode().filter(e.getKey()::equals).isPresent() ? " (output)" : "");
                b.append("| ").append(name).append(" | ").append(number(e.getValue())).append(" |\n");
            }
            b.append('\n');
            if (!r.opAmps().isEmpty()) {
                b.append("| op-amp | out (V) | in+ (V) | in− (V) | swing low (V) | swing high (V) | saturated"
                        + " | common mode ok |\n|---|---:|---:|---:|---:|---:|---|---|\n");
                for (OpAmpRow s : r.opAmps()) {
                    b.append(String.format(Locale.ROOT, "| %s | %s | %s | %s | %.3f | %.3f | %s | %s |%n",
                            md(s.name()), number(s.output()), number(s.inPlus()), number(s.inMinus()),
                            s.swingLow(), s.swingHigh(), s.saturated() ? "yes" : "no",
                            s.commonModeOk() ? "yes" : "no"));
                }
                b.append('\n');
            }
            if (!r.floating().isEmpty()) {
                b.append("Floating nodes: ").append(md(String.join(", ", r.floating()))).append("\n\n");
            }
            if (!r.findings().isEmpty()) {
                b.append("Findings:\n\n");
                for (Finding f : r.findings()) {
                    b.append("- **").append(f.severity().name()).append("** `").append(f.code()).append('`');
                    if (!f.parts().isEmpty()) {
                        b.append(" (").append(md(String.join(", ", f.parts()))).append(')');
                    }
                    b.append(": ").append(md(f.message()));
                    if (!f.suggestion().isEmpty()) {
                        b.append(" — ").append(md(f.suggestion()));
                    }
                    b.append('\n');
                }
                b.append('\n');
            }
        }
        return b.toString();
    }

    static String json(List<CheckCommand.Outcome> outcomes, Severity failOn) {
        ObjectNode root = JSON.createObjectNode();
        root.put("version", HalfrailCommand.VERSION);
        root.put("failOn", FileReport.label(failOn));
        ArrayNode files = root.putArray("files");
        for (CheckCommand.Outcome o : outcomes) {
            ObjectNode f = files.addObject();
            f.put("file", o.file());
            if (o.report() == null) {
                f.put("error", o.error());
                continue;
            }
            FileReport r = o.report();
            f.put("title", r.title());
            f.put("verdict", r.verdict());
            f.put("outputNode", r.outputNode().orElse(null));
            ObjectNode nodes = f.putObject("nodes");
            r.nodeVolts().forEach((k, v) -> {
                if (v == null) {
                    nodes.putNull(k);
                } else {
                    nodes.put(k, v);
                }
            });
            ArrayNode opAmps = f.putArray("opamps");
            for (OpAmpRow s : r.opAmps()) {
                ObjectNode a = opAmps.addObject();
                a.put("name", s.name());
                a.put("output", s.output());
                a.put("inPlus", s.inPlus());
                a.put("inMinus", s.inMinus());
                a.put("swingLow", s.swingLow());
                a.put("swingHigh", s.swingHigh());
                a.put("commonModeLow", s.commonModeLow());
                a.put("commonModeHigh", s.commonModeHigh());
                a.put("saturated", s.saturated());
                a.put("commonModeOk", s.commonModeOk());
            }
            ArrayNode floating = f.putArray("floating");
            r.floating().forEach(floating::add);
            f.put("lowerCornerHz", r.lowerCornerHz());
            f.put("settleTime", r.settleSeconds());
            if (r.oscillation().isPresent()) {
                ObjectNode w = f.putObject("oscillation");
                w.put("node", r.oscillation().get().node());
                w.put("periodSeconds", r.oscillation().get().periodSeconds());
                w.put("peakToPeakVolts", r.oscillation().get().peakToPeakVolts());
            } else {
                f.putNull("oscillation");
            }
            ArrayNode findings = f.putArray("findings");
            for (Finding x : r.findings()) {
                ObjectNode n = findings.addObject();
                n.put("code", x.code());
                n.put("severity", FileReport.label(x.severity()));
                n.put("message", x.message());
                ArrayNode parts = n.putArray("parts");
                x.parts().forEach(parts::add);
                n.put("suggestion", x.suggestion());
            }
            ArrayNode notes = f.putArray("notes");
            r.notes().forEach(notes::add);
        }
        try {
            return JSON.writeValueAsString(root) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a JSON tree of strings and numbers could not be written", e);
        }
    }

    private static String volts(Double v) {
        return v == null ? "undefined" : String.format(Locale.ROOT, "%.4f V", v);
    }

    private static String number(Double v) {
        return v == null ? "undefined" : String.format(Locale.ROOT, "%.4f", v);
    }

    private static String pad(String s, int width) {
        return s + " ".repeat(Math.max(0, width - s.length()));
    }

    /** Markdown-safe text: escapes the characters that would start markup. */
    private static String md(String s) {
        return s.replace("\\", "\\\\").replace("|", "\\|").replace("*", "\\*").replace("_", "\\_")
                .replace("`", "\\`").replace("<", "&lt;");
    }
}
