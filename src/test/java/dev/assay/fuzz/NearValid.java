package dev.assay.fuzz;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

/**
 * One grammar-level change to a valid file. Some changes keep the meaning (a byte-order mark at the start, CRLF or CR
 * line ends, tabs for spaces, Unicode spellings of keywords, a comment line, parentheses around a formula, a longer
 * label): the verdict must not change. Some changes put one character that starts no token, or a byte that is not
 * UTF-8, at a known place: the check must be an input error at exactly that line and column. The rest (a token
 * dropped, duplicated or swapped, a keyword misspelt, an unbalanced bracket, an index out of range, a huge numeral,
 * deep nesting, a long name, a truncated file) only have to be refused or accepted without a crash.
 */
public final class NearValid {

    public enum Kind {
        DROP_TOKEN, DUPLICATE_TOKEN, SWAP_TOKENS, MISSPELL_KEYWORD, UNBALANCED_BRACKET, INDEX_ZERO, NUMBER_OUT_OF_RANGE,
        HUGE_NUMERAL, DEEP_PARENTHESES, DEEP_NOT, DEEP_TERM, LONG_NAME, LONG_LABEL, NON_UTF8, ILLEGAL_CHARACTER, NUL,
        BOM_AT_START, BOM_INSIDE, CRLF, CR, TABS, UNICODE_SPELLING, COMMENT_LINE, TRUNCATE
    }

    /** What a mutant promises: the same verdict as the original, an input error at a place, or nothing. */
    public enum Promise { SAME_VERDICT, INPUT_ERROR_AT, NONE }

    /** A mutant: its bytes, the change, what it promises, and the 1-based line and column of the error it promises. */
    public record Mutant(Kind kind, byte[] bytes, Promise promise, int line, int column, String detail) {
        @Override
        public String toString() {
            return kind + (detail.isEmpty() ? "" : " (" + detail + ")") + (promise == Promise.INPUT_ERROR_AT
                    ? " expecting an input error at " + line + ":" + column : promise == Promise.SAME_VERDICT
                    ? " expecting the original verdict" : "");
        }
    }

    private static final Set<String> KEYWORDS = Set.of(SyntaxGen.KEYWORDS);
    private static final Map<String, String> UNICODE = Map.ofEntries(Map.entry("forall", "\u2200"),
            Map.entry("exists", "\u2203"), Map.entry("not", "\u00ac"), Map.entry("and", "\u2227"),
            Map.entry("or", "\u2228"), Map.entry("implies", "\u2192"), Map.entry("iff", "\u2194"),
            Map.entry("true", "\u22a4"), Map.entry("false", "\u22a5"), Map.entry("!=", "\u2260"),
            Map.entry(":=", "\u21a6"));
    private static final byte[][] BAD_BYTES = {{(byte) 0x80}, {(byte) 0xC3}, {(byte) 0xFF}, {(byte) 0xFE},
        {(byte) 0xC0, (byte) 0xAF}, {(byte) 0xED, (byte) 0xA0, (byte) 0x80}, {(byte) 0xF0, (byte) 0x9F, (byte) 0x98},
        {(byte) 0xF4, (byte) 0x90, (byte) 0x80, (byte) 0x80}, {(byte) 0xE2, (byte) 0x88}};

    private final Random random;
    /** Largest nesting a DEEP_* change makes. */
    private final int maxNesting;

    public NearValid(Random random, int maxNesting) {
        this.random = random;
        this.maxNesting = maxNesting;
    }

    /** Splits text into tokens, keeping every character: words, numbers, white space, comments, strings, symbols. */
    public static List<String> tokens(String text) {
        List<String> out = new ArrayList<>();
        int i = 0;
        while (i < text.length()) {
            int j = i + 1;
            char c = text.charAt(i);
            if (Character.isLetterOrDigit(c) || c == '_') {
                while (j < text.length() && (Character.isLetterOrDigit(text.charAt(j)) || text.charAt(j) == '_')) j++;
            } else if (Character.isWhitespace(c) || c == '\uFEFF') {
                while (j < text.length() && (Character.isWhitespace(text.charAt(j)) || text.charAt(j) == '\uFEFF')) j++;
            } else if (c == '#') {
                while (j < text.length() && text.charAt(j) != '\n' && text.charAt(j) != '\r') j++;
            } else if (c == '"') {
                while (j < text.length() && text.charAt(j) != '"' && text.charAt(j) != '\n') j++;
                if (j < text.length() && text.charAt(j) == '"') j++;
            } else if (i + 1 < text.length() && List.of(":=", "!=", "->", "<-").contains(text.substring(i, i + 2))) {
                j = i + 2;
            } else if (Character.isHighSurrogate(c) && j < text.length()) {
                j++;
            }
            out.add(text.substring(i, j));
            i = j;
        }
        return out;
    }

    static boolean significant(String token) {
        char c = token.charAt(0);
        return !(Character.isWhitespace(c) || c == '\uFEFF' || c == '#');
    }

    static boolean word(String token) {
        return Character.isLetter(token.charAt(0)) || token.charAt(0) == '_';
    }

    static boolean number(String token) {
        return Character.isDigit(token.charAt(0));
    }

    private int pickIndex(List<String> tokens, java.util.function.Predicate<String> which) {
        List<Integer> fit = new ArrayList<>();
        for (int i = 0; i < tokens.size(); i++) if (which.test(tokens.get(i))) fit.add(i);
        return fit.isEmpty() ? -1 : fit.get(random.nextInt(fit.size()));
    }

    public Mutant mutate(String text) {
        Kind kind = Kind.values()[random.nextInt(Kind.values().length)];
        Mutant m = mutate(text, kind);
        // A file without the token a change needs gets a dropped token instead.
        return m != null ? m : mutate(text, Kind.DROP_TOKEN);
    }

    public Mutant mutate(String text, Kind kind) {
        List<String> t = tokens(text);
        switch (kind) {
            case DROP_TOKEN -> {
                int i = pickIndex(t, NearValid::significant);
                if (i < 0) return null;
                String gone = t.remove(i);
                return none(kind, t, "dropped " + shortly(gone));
            }
            case DUPLICATE_TOKEN -> {
                int i = pickIndex(t, NearValid::significant);
                if (i < 0) return null;
                t.add(i, t.get(i) + " ");
                return none(kind, t, "doubled " + shortly(t.get(i)));
            }
            case SWAP_TOKENS -> {
                int i = pickIndex(t, NearValid::significant);
                int j = pickIndex(t, NearValid::significant);
                if (i < 0 || i == j) return null;
                String a = t.get(i);
                t.set(i, t.get(j));
                t.set(j, a);
                return none(kind, t, "swapped tokens " + i + " and " + j);
            }
            case MISSPELL_KEYWORD -> {
                int i = pickIndex(t, KEYWORDS::contains);
                if (i < 0) return null;
                String k = t.get(i);
                int p = random.nextInt(k.length());
                String bad = switch (random.nextInt(4)) {
                    case 0 -> k.substring(0, p) + k.substring(p + 1);
                    case 1 -> k.substring(0, p) + k.charAt(p) + k.substring(p);
                    case 2 -> Character.toUpperCase(k.charAt(0)) + k.substring(1);
                    default -> k + "s";
                };
                t.set(i, bad);
                return none(kind, t, k + " -> " + bad);
            }
            case UNBALANCED_BRACKET -> {
                if (random.nextBoolean()) {
                    int i = pickIndex(t, s -> s.length() == 1 && "()[]{}".contains(s));
                    if (i < 0) return null;
                    String gone = t.remove(i);
                    return none(kind, t, "dropped " + gone);
                }
                int i = pickIndex(t, NearValid::significant);
                if (i < 0) return null;
                String b = String.valueOf("()[]{}".charAt(random.nextInt(6)));
                t.add(i, b);
                return none(kind, t, "added " + b);
            }
            case INDEX_ZERO, NUMBER_OUT_OF_RANGE, HUGE_NUMERAL -> {
                int i = pickIndex(t, NearValid::number);
                if (i < 0) return null;
                String n = switch (kind) {
                    case INDEX_ZERO -> random.nextBoolean() ? "0" : "00";
                    case NUMBER_OUT_OF_RANGE -> new String[] {"99999999999", "2147483648", "2147483647", "7", "65536"}[random.nextInt(5)];
                    default -> "9".repeat(30 + random.nextInt(20_000));
                };
                String was = t.get(i);
                t.set(i, n);
                return none(kind, t, was + " -> " + shortly(n));
            }
            case DEEP_PARENTHESES, DEEP_NOT -> {
                // The formula of an axiom, the goal or a formula step: from after "NAME:" or "formula" to before
                // "by" or the next statement.
                int start = pickIndex(t, s -> s.equals("formula") || s.equals(":"));
                if (start < 0) return null;
                if (t.get(start).equals(":") && !isFormulaColon(t, start)) return null;
                int end = formulaEnd(t, start);
                if (end <= start) return null;
                int n = 1 + random.nextInt(random.nextInt(4) == 0 ? maxNesting : Math.min(maxNesting, 200));
                if (kind == Kind.DEEP_NOT) n = 2 * ((n + 1) / 2);
                String open = kind == Kind.DEEP_PARENTHESES ? "(".repeat(n) : "not ".repeat(n);
                t.add(end + 1, kind == Kind.DEEP_PARENTHESES ? ")".repeat(n) : "");
                t.add(start + 1, " " + open);
                // Parentheses around a formula change nothing while the nesting stays well under the depth limit.
                boolean same = kind == Kind.DEEP_PARENTHESES && n <= 1000;
                return new Mutant(kind, utf8(t), same ? Promise.SAME_VERDICT : Promise.NONE, 0, 0, "depth " + n);
            }
            case DEEP_TERM -> {
                int f = pickIndex(t, s -> word(s) && !KEYWORDS.contains(s) && Character.isLowerCase(s.charAt(0)));
                int i = f < 0 ? -1 : pickIndex(t, s -> word(s) && !KEYWORDS.contains(s));
                if (i < 0) return null;
                int n = 1 + random.nextInt(maxNesting);
                String fn = t.get(f);
                t.set(i, (fn + "(").repeat(n) + t.get(i) + ")".repeat(n));
                return none(kind, t, shortly(fn) + " nested " + n);
            }
            case LONG_NAME -> {
                int i = pickIndex(t, s -> word(s) && !KEYWORDS.contains(s));
                if (i < 0) return null;
                String was = t.get(i);
                String longer = was + "_" + "w".repeat(1000 + random.nextInt(60_000));
                boolean all = random.nextBoolean();
                for (int k = 0; k < t.size(); k++) if (t.get(k).equals(was) && (all || k == i)) t.set(k, longer);
                return none(kind, t, (all ? "every " : "one ") + shortly(was) + " lengthened");
            }
            case LONG_LABEL -> {
                // A label defined by a step, renamed everywhere: labels are their own namespace, so nothing changes
                // unless the label is also spelled like a symbol or a variable of the file.
                List<String> labels = new ArrayList<>();
                for (int k = 0; k + 2 < t.size(); k++) {
                    if (t.get(k).equals("step") && word(t.get(k + 2))) labels.add(t.get(k + 2));
                }
                if (labels.isEmpty()) return null;
                String was = labels.get(random.nextInt(labels.size()));
                String longer = was + "_" + "v".repeat(1000 + random.nextInt(30_000));
                for (int k = 0; k < t.size(); k++) if (t.get(k).equals(was)) t.set(k, longer);
                return new Mutant(kind, utf8(t), Promise.SAME_VERDICT, 0, 0, shortly(was) + " lengthened");
            }
            case NON_UTF8, ILLEGAL_CHARACTER, NUL -> {
                // A character that starts no token, put between two tokens, is the first thing wrong in the file;
                // put inside a word it splits the word, and the parser may complain first about the part before it.
                boolean between = kind != Kind.NON_UTF8 && random.nextBoolean();
                int[] at = between ? tokenBoundary(text, t) : boundary(text);
                int offset = at[0];
                boolean inComment = insideCommentOrString(t, offset);
                between |= atTokenBoundary(t, offset);
                byte[] insert = switch (kind) {
                    case NON_UTF8 -> BAD_BYTES[random.nextInt(BAD_BYTES.length)];
                    case NUL -> new byte[] {0};
                    default -> utf8(new String[] {"$", "%", "\u00e9", "?", "&", "\u00a0", "\\", "'"}[random.nextInt(8)]);
                };
                byte[] before = text.substring(0, offset).getBytes(StandardCharsets.UTF_8);
                byte[] after = text.substring(offset).getBytes(StandardCharsets.UTF_8);
                ByteArrayOutputStream out = new ByteArrayOutputStream();
                out.writeBytes(before);
                out.writeBytes(insert);
                out.writeBytes(after);
                // Bytes that are not UTF-8 are an error anywhere, comments included (docs/format.md §1); a character
                // that starts no token is one outside comments and strings.
                Promise p;
                if (kind == Kind.NON_UTF8) p = Promise.INPUT_ERROR_AT;
                else if (inComment) p = insideString(t, offset) ? Promise.NONE : Promise.SAME_VERDICT;
                else p = between ? Promise.INPUT_ERROR_AT : Promise.NONE;
                return new Mutant(kind, out.toByteArray(), p, at[1], at[2], hex(insert) + " at byte " + before.length);
            }
            case BOM_AT_START -> {
                return new Mutant(kind, utf8("\uFEFF" + text), Promise.SAME_VERDICT, 0, 0, "");
            }
            case BOM_INSIDE -> {
                int i = pickIndex(t, s -> !significant(s) && !s.startsWith("#"));
                if (i < 0) return null;
                t.set(i, t.get(i) + "\uFEFF");
                return new Mutant(kind, utf8(t), Promise.SAME_VERDICT, 0, 0, "after token " + i);
            }
            case CRLF -> {
                return new Mutant(kind, utf8(text.replace("\r\n", "\n").replace("\n", "\r\n")), Promise.SAME_VERDICT, 0, 0, "");
            }
            case CR -> {
                return new Mutant(kind, utf8(text.replace("\r\n", "\n").replace("\n", "\r")), Promise.SAME_VERDICT, 0, 0, "");
            }
            case TABS -> {
                for (int k = 0; k < t.size(); k++) {
                    if (!significant(t.get(k)) && !t.get(k).startsWith("#")) t.set(k, t.get(k).replace(' ', '\t'));
                }
                return new Mutant(kind, utf8(t), Promise.SAME_VERDICT, 0, 0, "");
            }
            case UNICODE_SPELLING -> {
                int changed = 0;
                for (int k = 0; k < t.size(); k++) {
                    String u = UNICODE.get(t.get(k));
                    if (u != null && random.nextBoolean()) {
                        t.set(k, u);
                        changed++;
                    }
                }
                return new Mutant(kind, utf8(t), Promise.SAME_VERDICT, 0, 0, changed + " spelt in Unicode");
            }
            case COMMENT_LINE -> {
                List<Integer> starts = new ArrayList<>();
                starts.add(0);
                for (int k = 0; k < text.length(); k++) if (text.charAt(k) == '\n') starts.add(k + 1);
                int at = starts.get(random.nextInt(starts.size()));
                String comment = "# \u2200 note: step by resolve \"quoted\" { ( [\n";
                return new Mutant(kind, utf8(text.substring(0, at) + comment + text.substring(at)),
                        Promise.SAME_VERDICT, 0, 0, "at char " + at);
            }
            case TRUNCATE -> {
                int[] at = boundary(text);
                return new Mutant(kind, utf8(text.substring(0, at[0])), Promise.NONE, 0, 0, "at char " + at[0]);
            }
            default -> throw new IllegalArgumentException(kind.toString());
        }
    }

    private static boolean isFormulaColon(List<String> t, int colon) {
        for (int k = colon - 1; k >= 0; k--) {
            if (!significant(t.get(k))) continue;
            // NAME ':' after axiom or goal
            for (int j = k - 1; j >= 0; j--) {
                if (!significant(t.get(j))) continue;
                return t.get(j).equals("axiom") || t.get(j).equals("goal");
            }
            return false;
        }
        return false;
    }

    /** Index of the last significant token of the formula that starts after {@code start}. */
    private static int formulaEnd(List<String> t, int start) {
        int last = -1;
        for (int k = start + 1; k < t.size(); k++) {
            String s = t.get(k);
            if (!significant(s)) continue;
            if (Set.of("by", "axiom", "goal", "declare", "problem", "step", "forget", "certificate").contains(s)) break;
            last = k;
        }
        return last;
    }

    /** A random code point boundary of text: {offset, line, column}, lines and columns from 1, as the lexer counts. */
    private int[] boundary(String text) {
        int offset = text.isEmpty() ? 0 : random.nextInt(text.length() + 1);
        if (offset > 0 && offset < text.length() && Character.isLowSurrogate(text.charAt(offset))) offset--;
        return position(text, offset);
    }

    private static int[] position(String text, int offset) {
        int line = 1;
        int column = 1;
        for (int k = 0; k < offset; k++) {
            char c = text.charAt(k);
            if (c == '\n') {
                line++;
                column = 1;
            } else if (!Character.isLowSurrogate(c)) {
                column++;
            }
        }
        return new int[] {offset, line, column};
    }

    /** The start of a random token (or the end of the text): {offset, line, column}. */
    private int[] tokenBoundary(String text, List<String> t) {
        int k = random.nextInt(t.size() + 1);
        int offset = 0;
        for (int i = 0; i < k; i++) offset += t.get(i).length();
        return position(text, offset);
    }

    private static boolean atTokenBoundary(List<String> t, int offset) {
        int pos = 0;
        for (String s : t) {
            if (pos == offset) return true;
            pos += s.length();
        }
        return pos == offset;
    }

    private static boolean insideCommentOrString(List<String> t, int offset) {
        int pos = 0;
        for (String s : t) {
            if (offset > pos && offset < pos + s.length() + (s.startsWith("#") ? 1 : 0)) {
                return s.startsWith("#") || s.startsWith("\"");
            }
            pos += s.length();
        }
        return false;
    }

    private static boolean insideString(List<String> t, int offset) {
        int pos = 0;
        for (String s : t) {
            if (offset > pos && offset < pos + s.length()) return s.startsWith("\"");
            pos += s.length();
        }
        return false;
    }

    private static Mutant none(Kind kind, List<String> tokens, String detail) {
        return new Mutant(kind, utf8(tokens), Promise.NONE, 0, 0, detail);
    }

    static byte[] utf8(List<String> tokens) {
        return utf8(String.join("", tokens));
    }

    static byte[] utf8(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    static String shortly(String s) {
        return s.length() <= 24 ? s : s.substring(0, 20) + "…(" + s.length() + " chars)";
    }

    static String hex(byte[] bytes) {
        StringBuilder sb = new StringBuilder();
        for (byte b : bytes) sb.append(String.format("%02X", b & 0xff));
        return sb.toString();
    }
}
