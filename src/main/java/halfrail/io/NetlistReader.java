package halfrail.io;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CircuitException;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads the netlist subset described in {@code docs/netlist.md} into a {@link Circuit}.
 *
 * <p>Every problem ends in a {@link NetlistException} that names its kind and line; no other
 * unchecked exception leaves the reader, whatever the text. Files larger than
 * {@link #MAX_BYTES} are refused before they are read.
 *
 * <p>Names are case-insensitive: {@code OUT} and {@code out} are one node, spelt in the circuit
 * as first seen; element names keep the spelling of their line. Element order, and so node
 * order, follows the file.
 */
public final class NetlistReader {
    /** Largest netlist accepted: 4 MiB of UTF-8 (for text already in memory, 4 Mi characters). */
    public static final long MAX_BYTES = 4L * 1024 * 1024;

    /** Analysis and output directives that are accepted and reported as notes. */
    static final Set<String> IGNORED_DIRECTIVES = Set.of(".op", ".tran", ".ac", ".dc", ".print", ".plot",
            ".options", ".option", ".probe", ".save", ".temp", ".meas", ".measure", ".four", ".noise", ".tf",
            ".sens", ".ic", ".nodeset", ".width", ".title");
    /** Directives of full SPICE that would change the circuit and that the subset does not have. */
    static final Set<String> UNSUPPORTED_DIRECTIVES = Set.of(".subckt", ".ends", ".include", ".inc", ".lib",
            ".endl", ".param", ".func", ".global", ".control", ".endc", ".connect", ".csparam");

    /** The op-amp {@code .model} parameter names, in the order the writer uses. */
    static final List<String> MODEL_PARAMETERS = List.of("avol", "gbw", "sr", "vos", "ib", "ios",
            "swing_low", "swing_high", "cm_low", "cm_high", "rout", "iq");

    private static final Pattern OUTPUT_COMMENT =
            Pattern.compile("^\\*\\s*output\\s*:\\s*(\\S*)", Pattern.CASE_INSENSITIVE);

    private NetlistReader() {}

    /**
     * Read a netlist file (UTF-8).
     *
     * @throws NetlistException UNREADABLE when the file cannot be read, TOO_LARGE above
     *                          {@link #MAX_BYTES}, BAD_ENCODING when it is not UTF-8, or any
     *                          parse error of {@link #parse(String)}
     */
    public static Netlist read(Path file) {
        byte[] bytes;
        try {
            if (!Files.isRegularFile(file)) {
                throw new NetlistException(NetlistException.Kind.UNREADABLE, 0, 0,
                        Files.exists(file) ? "not a regular file" : "no such file", "a readable netlist file");
            }
            long size = Files.size(file);
            if (size > MAX_BYTES) {
                throw tooLarge(size + " bytes");
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new NetlistException(NetlistException.Kind.UNREADABLE, 0, 0, "no such file",
                    "a readable netlist file", e);
        } catch (IOException | SecurityException e) {
            throw new NetlistException(NetlistException.Kind.UNREADABLE, 0, 0,
                    "cannot read: " + e.getClass().getSimpleName()
                            + (e.getMessage() == null ? "" : " " + e.getMessage()), "a readable netlist file", e);
        }
        if (bytes.length > MAX_BYTES) {
            throw tooLarge(bytes.length + " bytes");
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new NetlistException(NetlistException.Kind.BAD_ENCODING, 0, 0, "the file is not UTF-8 text",
                    "a UTF-8 text file", e);
        }
        return parse(text);
    }

    /**
     * Parse netlist text. The first line is the title.
     *
     * @throws NetlistException for every problem, with its kind and line
     */
    public static Netlist parse(String text) {
        if (text == null) {
            throw new NetlistException(NetlistException.Kind.EMPTY, 0, 0, "no text", "a netlist");
        }
        if (text.length() > MAX_BYTES) {
            throw tooLarge(text.length() + " characters");
        }
        return new Parse(text).run();
    }

    private static NetlistException tooLarge(String size) {
        return new NetlistException(NetlistException.Kind.TOO_LARGE, 0, 0,
                "the netlist is " + size + ", above the limit of " + MAX_BYTES + " bytes",
                "a netlist of at most 4 MiB");
    }

    /** A token of a logical line with the position where it starts. */
    private record Token(String text, int line, int column) {
        String lower() {
            return text.toLowerCase(Locale.ROOT);
        }
    }

    /** A model as read from its {@code .model} line. */
    private record ModelDef(String name, OpAmpParams params, int line) {}

    /** An op-amp waiting for its model, which may be defined further down. */
    private record PendingOpAmp(Token name, List<String> nodes, Token model) {}

    /** One state of one parse; not reused. */
    private static final class Parse {
        private final String text;
        private final List<Object> elements = new ArrayList<>();
        private final List<Integer> elementLines = new ArrayList<>();
        private final Map<String, String> nodeSpelling = new HashMap<>();
        private final Map<String, ModelDef> models = new LinkedHashMap<>();
        private final Map<String, Boolean> modelUsed = new HashMap<>();
        private final List<Netlist.Note> notes = new ArrayList<>();
        private Token outputNode;
        private String title = "";

        Parse(String text) {
            this.text = text.startsWith("\uFEFF") ? text.substring(1) : text;
        }

        Netlist run() {
            List<String> physical = splitLines(text);
            List<List<Token>> logical = new ArrayList<>();
            boolean ended = false;
            int afterEnd = 0;
            for (int i = 0; i < physical.size(); i++) {
                int lineNo = i + 1;
                String line = physical.get(i);
                if (i == 0) {
                    title = NetlistException.oneLine(line).strip();
                    continue;
                }
                String body = line.stripLeading();
                if (body.isEmpty()) {
                    continue;
                }
                if (ended) {
                    if (afterEnd == 0) {
                        afterEnd = lineNo;
                    }
                    continue;
                }
                if (body.charAt(0) == '*') {
                    outputComment(body, lineNo, line.length() - body.length() + 1);
                    continue;
                }
                int offset = line.length() - body.length();
                if (body.charAt(0) == '+') {
                    if (logical.isEmpty()) {
                        throw new NetlistException(NetlistException.Kind.ORPHAN_CONTINUATION, lineNo, offset + 1,
                                "a '+' continuation line with no element or directive before it to continue",
                                "an element or directive line before the '+' line");
                    }
                    logical.get(logical.size() - 1).addAll(tokens(body.substring(1), lineNo, offset + 2));
                    continue;
                }
                List<Token> tokens = tokens(body, lineNo, offset + 1);
                if (tokens.isEmpty()) {
                    continue;
                }
                if (tokens.get(0).lower().equals(".end")) {
                    if (tokens.size() > 1) {
                        throw unexpected(tokens.get(1), "nothing after .end");
                    }
                    ended = true;
                    continue;
                }
                logical.add(tokens);
            }
            for (List<Token> tokens : logical) {
                statement(tokens);
            }
            if (!ended) {
                notes.add(new Netlist.Note(0, "no .end line; the whole file was read"));
            } else if (afterEnd > 0) {
                notes.add(new Netlist.Note(afterEnd, "text after .end ignored"));
            }
            return finish();
        }

        private void outputComment(String body, int lineNo, int column) {
            Matcher m = OUTPUT_COMMENT.matcher(body);
            if (!m.find()) {
                return;
            }
            if (m.group(1).isEmpty()) {
                throw new NetlistException(NetlistException.Kind.MISSING_FIELD, lineNo, column,
                        "'* output:' without a node name", "a node name after 'output:'");
            }
            Token node = new Token(m.group(1), lineNo, column + m.start(1));
            if (outputNode != null) {
                throw new NetlistException(NetlistException.Kind.DUPLICATE_OUTPUT, lineNo, column,
                        "a second '* output:' comment (the first is on line " + outputNode.line() + ")",
                        "one '* output:' comment");
            }
            checkName(node, "node");
            outputNode = node;
        }

        private void statement(List<Token> tokens) {
            Token first = tokens.get(0);
            String word = first.lower();
            if (word.startsWith(".")) {
                directive(tokens);
                return;
            }
            char letter = word.charAt(0);
            switch (letter) {
                case 'r' -> twoTerminal(tokens, "resistor", "a resistance in Ω");
                case 'c' -> twoTerminal(tokens, "capacitor", "a capacitance in F");
                case 'v' -> voltageSource(tokens);
                case 'i' -> currentSource(tokens);
                case 'x' -> opAmp(tokens);
                default -> {
                    if (Character.isLetter(letter)) {
                        throw new NetlistException(NetlistException.Kind.UNSUPPORTED_ELEMENT, first.line(),
                                first.column(), "element '" + first.text() + "': type '"
                                + first.text().charAt(0) + "' is outside the netlist subset",
                                "R, C, V, I or X (op-amp)");
                    }
                    throw unexpected(first, "an element (R, C, V, I, X), a .directive or a * comment");
                }
            }
        }

        private void directive(List<Token> tokens) {
            Token first = tokens.get(0);
            String word = first.lower();
            if (word.equals(".model")) {
                model(tokens);
            } else if (IGNORED_DIRECTIVES.contains(word)) {
                notes.add(new Netlist.Note(first.line(), "'" + word
                        + "' ignored: the check command chooses the analyses, not the netlist"));
            } else if (UNSUPPORTED_DIRECTIVES.contains(word)) {
                throw new NetlistException(NetlistException.Kind.UNSUPPORTED_DIRECTIVE, first.line(), first.column(),
                        "'" + first.text() + "' is outside the netlist subset",
                        ".model, .end or an analysis directive");
            } else {
                throw new NetlistException(NetlistException.Kind.UNKNOWN_DIRECTIVE, first.line(), first.column(),
                        "unknown directive '" + first.text() + "'", ".model, .end or an analysis directive");
            }
        }

        private void twoTerminal(List<Token> t, String what, String valueMeaning) {
            Token name = t.get(0);
            checkName(name, what + " name");
            Token a = field(t, 1, "the first node of " + what + " " + name.text());
            Token b = field(t, 2, "the second node of " + what + " " + name.text());
            Token v = field(t, 3, valueMeaning + " for " + name.text());
            noMore(t, 4);
            String na = node(a);
            String nb = node(b);
            double value = value(v);
            boolean resistor = what.equals("resistor");
            add(name.line(), () -> resistor ? new Resistor(name.text(), na, nb, value)
                    : new Capacitor(name.text(), na, nb, value));
        }

        private void voltageSource(List<Token> t) {
            Token name = t.get(0);
            checkName(name, "source name");
            String plus = node(field(t, 1, "the + node of " + name.text()));
            String minus = node(field(t, 2, "the − node of " + name.text()));
            int pos = 3;
            double dc = 0;
            double ac = 0;
            boolean any = false;
            if (pos < t.size() && t.get(pos).lower().equals("dc")) {
                dc = value(field(t, pos + 1, "a DC value in V after DC"));
                pos += 2;
                any = true;
            } else if (pos < t.size() && !t.get(pos).lower().equals("ac")) {
                dc = value(t.get(pos));
                pos++;
                any = true;
            }
            if (pos < t.size() && t.get(pos).lower().equals("ac")) {
                ac = value(field(t, pos + 1, "an AC magnitude in V after AC"));
                pos += 2;
                any = true;
            }
            if (!any) {
                field(t, pos, "a DC value in V for " + name.text());
            }
            noMore(t, pos);
            double dcVolts = dc;
            double acVolts = ac;
            add(name.line(), () -> new VoltageSource(name.text(), plus, minus, dcVolts, acVolts, 0, 0));
        }

        private void currentSource(List<Token> t) {
            Token name = t.get(0);
            checkName(name, "source name");
            String from = node(field(t, 1, "the + node of " + name.text()));
            String to = node(field(t, 2, "the − node of " + name.text()));
            int pos = 3;
            if (pos < t.size() && t.get(pos).lower().equals("dc")) {
                pos++;
            }
            double amps = value(field(t, pos, "a DC current in A for " + name.text()));
            noMore(t, pos + 1);
            add(name.line(), () -> new CurrentSource(name.text(), from, to, amps));
        }

        private void opAmp(List<Token> t) {
            Token name = t.get(0);
            checkName(name, "op-amp name");
            String[] roles = {"in+", "in−", "V+ (positive supply)", "V− (negative supply)", "output"};
            Token[] nodes = new Token[5];
            for (int i = 0; i < 5; i++) {
                nodes[i] = field(t, i + 1, "the " + roles[i] + " node of " + name.text());
            }
            Token model = field(t, 6, "a model name after the five nodes of " + name.text());
            noMore(t, 7);
            checkName(model, "model name");
            List<String> names = new ArrayList<>(5);
            for (Token n : nodes) {
                names.add(node(n));
            }
            elements.add(new PendingOpAmp(name, names, model));
            elementLines.add(name.line());
        }

        private void model(List<Token> t) {
            Token dot = t.get(0);
            Token name = field(t, 1, "a model name after .model");
            checkName(name, "model name");
            Token type = field(t, 2, "the model type 'opamp'");
            if (!type.lower().equals("opamp")) {
                throw new NetlistException(NetlistException.Kind.UNSUPPORTED_MODEL, type.line(), type.column(),
                        "model type '" + type.text() + "' is outside the netlist subset", "opamp");
            }
            ModelDef earlier = models.get(name.lower());
            if (earlier != null) {
                throw new NetlistException(NetlistException.Kind.DUPLICATE_MODEL, name.line(), name.column(),
                        "a second .model named '" + name.text() + "' (the first is on line " + earlier.line() + ")",
                        "one .model per name");
            }
            Map<String, Double> given = new LinkedHashMap<>();
            int pos = 3;
            while (pos < t.size()) {
                Token key = t.get(pos);
                String k = key.lower();
                if (!MODEL_PARAMETERS.contains(k)) {
                    throw new NetlistException(NetlistException.Kind.UNKNOWN_PARAMETER, key.line(), key.column(),
                            "unknown op-amp parameter '" + key.text() + "'", "one of " + String.join(", ",
                            MODEL_PARAMETERS));
                }
                if (given.containsKey(k)) {
                    throw new NetlistException(NetlistException.Kind.DUPLICATE_MODEL, key.line(), key.column(),
                            "parameter '" + k + "' given twice", "each parameter at most once");
                }
                Token eq = field(t, pos + 1, "'=' after " + k);
                if (!eq.text().equals("=")) {
                    throw unexpected(eq, "'=' after " + k);
                }
                given.put(k, value(field(t, pos + 2, "a value after " + k + "=")));
                pos += 3;
            }
            OpAmpParams p;
            try {
                p = params(given);
            } catch (CircuitException e) {
                throw new NetlistException(NetlistException.Kind.BAD_ELEMENT, dot.line(), 0,
                        "model '" + name.text() + "': " + e.getMessage(), "parameters inside their valid range", e);
            }
            models.put(name.lower(), new ModelDef(name.text(), p, dot.line()));
        }

        private static OpAmpParams params(Map<String, Double> g) {
            OpAmpParams d = OpAmpParams.defaults();
            return new OpAmpParams(
                    g.getOrDefault("avol", d.openLoopGain()),
                    g.getOrDefault("gbw", d.gainBandwidthHz()),
                    g.getOrDefault("sr", d.slewRateVoltsPerSecond()),
                    g.getOrDefault("vos", d.offsetVolts()),
                    g.getOrDefault("ib", d.biasAmps()),
                    g.getOrDefault("ios", d.offsetCurrentAmps()),
                    g.getOrDefault("cm_low", d.commonModeLowVolts()),
                    g.getOrDefault("cm_high", d.commonModeHighVolts()),
                    g.getOrDefault("swing_low", d.swingLowVolts()),
                    g.getOrDefault("swing_high", d.swingHighVolts()),
                    g.getOrDefault("rout", d.outputOhms()),
                    g.getOrDefault("iq", d.quiescentAmps()),
                    d.supplyMinVolts(), d.supplyMaxVolts());
        }

        /** An element built later, so that a refusal by the circuit model can name the line. */
        private interface ElementFactory {
            Element make();
        }

        private void add(int line, ElementFactory factory) {
            elements.add(factory);
            elementLines.add(line);
        }

        private Netlist finish() {
            if (elements.isEmpty()) {
                throw new NetlistException(NetlistException.Kind.EMPTY, 0, 0, "the netlist holds no element",
                        "at least one R, C, V, I or X line");
            }
            Circuit.Builder b = Circuit.builder().title(title).implicitNodes();
            Map<String, String> opAmpModels = new LinkedHashMap<>();
            for (int i = 0; i < elements.size(); i++) {
                Object pending = elements.get(i);
                int line = elementLines.get(i);
                try {
                    if (pending instanceof PendingOpAmp o) {
                        ModelDef m = models.get(o.model().lower());
                        if (m == null) {
                            throw new NetlistException(NetlistException.Kind.UNKNOWN_MODEL, line,
                                    o.model().column(), "op-amp " + o.name().text() + " uses model '"
                                    + o.model().text() + "', which no .model line defines",
                                    "a '.model " + o.model().text() + " opamp (...)' line");
                        }
                        modelUsed.put(o.model().lower(), true);
                        List<String> n = o.nodes();
                        b.add(new OpAmp(o.name().text(), n.get(0), n.get(1), n.get(2), n.get(3), n.get(4),
                                m.params()));
                        opAmpModels.put(o.name().text(), m.name());
                    } else {
                        b.add(((ElementFactory) pending).make());
                    }
                } catch (CircuitException e) {
                    throw new NetlistException(NetlistException.Kind.BAD_ELEMENT, line, 0, e.getMessage(),
                            "an element the circuit model accepts", e);
                }
            }
            Circuit circuit;
            try {
                circuit = b.build();
            } catch (CircuitException e) {
                throw new NetlistException(NetlistException.Kind.BAD_ELEMENT, 0, 0, e.getMessage(),
                        "a circuit the circuit model accepts", e);
            }
            Optional<String> output = Optional.empty();
            if (outputNode != null) {
                String lower = outputNode.lower();
                String spelt = nodeSpelling.get(lower);
                if (spelt == null || isGround(outputNode.text())) {
                    throw new NetlistException(NetlistException.Kind.UNKNOWN_NODE, outputNode.line(),
                            outputNode.column(), "output node '" + outputNode.text() + "' "
                            + (spelt == null && !isGround(outputNode.text()) ? "is not used by any element"
                            : "is ground"), "a node of the circuit other than ground");
                }
                output = Optional.of(spelt);
            }
            List<String> modelNames = new ArrayList<>();
            for (ModelDef m : models.values()) {
                modelNames.add(m.name());
                if (!modelUsed.containsKey(m.name().toLowerCase(Locale.ROOT))) {
                    notes.add(new Netlist.Note(m.line(), "model '" + m.name() + "' is not used by any op-amp"));
                }
            }
            notes.sort(java.util.Comparator.comparingInt(Netlist.Note::line));
            return new Netlist(circuit, output, notes, modelNames, opAmpModels);
        }

        private String node(Token t) {
            checkName(t, "node name");
            if (isGround(t.text())) {
                return Circuit.GROUND;
            }
            return nodeSpelling.computeIfAbsent(t.lower(), k -> t.text());
        }

        private double value(Token t) {
            try {
                return SpiceValues.parse(t.text());
            } catch (NetlistException e) {
                throw new NetlistException(e.kind(), t.line(), t.column(), e.problem(), e.expected());
            }
        }

        private static Token field(List<Token> t, int index, String expected) {
            if (index < t.size()) {
                return t.get(index);
            }
            Token last = t.get(t.size() - 1);
            throw new NetlistException(NetlistException.Kind.MISSING_FIELD, last.line(),
                    last.column() + last.text().length(), "the line ends too early", expected);
        }

        private static void noMore(List<Token> t, int count) {
            if (t.size() > count) {
                throw unexpected(t.get(count), "the end of the line");
            }
        }
    }

    static boolean isGround(String node) {
        return Circuit.GROUND.equals(node) || Circuit.GROUND_ALIAS.equalsIgnoreCase(node);
    }

    /** Whether {@code s} is usable as a node, element or model name in the subset. */
    static boolean isValidName(String s) {
        if (s.isEmpty() || s.length() > 200) {
            return false;
        }
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            boolean ok = Character.isLetterOrDigit(c) || "_.:-+/#[]<>$&!?~^@%|".indexOf(c) >= 0;
            if (!ok || Character.isSurrogate(c)) {
                return false;
            }
        }
        return true;
    }

    private static void checkName(Token t, String what) {
        if (!isValidName(t.text())) {
            throw new NetlistException(NetlistException.Kind.BAD_NAME, t.line(), t.column(),
                    "'" + NetlistException.oneLine(t.text()) + "' is not a usable " + what,
                    "letters, digits and _ . : - + / # [ ] < > $ & ! ? ~ ^ @ % | (at most 200)");
        }
    }

    private static NetlistException unexpected(Token t, String expected) {
        return new NetlistException(NetlistException.Kind.UNEXPECTED_TOKEN, t.line(), t.column(),
                "unexpected '" + NetlistException.oneLine(t.text()) + "'", expected);
    }

    private static List<String> splitLines(String text) {
        List<String> lines = new ArrayList<>();
        int start = 0;
        int n = text.length();
        for (int i = 0; i < n; i++) {
            char c = text.charAt(i);
            if (c == '\n' || c == '\r') {
                lines.add(text.substring(start, i));
                if (c == '\r' && i + 1 < n && text.charAt(i + 1) == '\n') {
                    i++;
                }
                start = i + 1;
            }
        }
        if (start < n) {
            lines.add(text.substring(start));
        }
        return lines;
    }

    /**
     * Split a line into tokens. Whitespace, parentheses and commas separate tokens; {@code =} is a
     * token of its own. Columns are 1-based; {@code firstColumn} is the column of {@code s}'s start.
     */
    private static List<Token> tokens(String s, int line, int firstColumn) {
        List<Token> out = new ArrayList<>();
        int i = 0;
        int n = s.length();
        while (i < n) {
            char c = s.charAt(i);
            if (isSeparator(c)) {
                i++;
                continue;
            }
            if (c == '=') {
                out.add(new Token("=", line, firstColumn + i));
                i++;
                continue;
            }
            int start = i;
            while (i < n && !isSeparator(s.charAt(i)) && s.charAt(i) != '=') {
                i++;
            }
            out.add(new Token(s.substring(start, i), line, firstColumn + start));
        }
        return out;
    }

    private static boolean isSeparator(char c) {
        return Character.isWhitespace(c) || Character.isSpaceChar(c) || c == '(' || c == ')' || c == ','
                || Character.isISOControl(c);
    }
}
