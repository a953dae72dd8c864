package dev.assay.syntax;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import org.antlr.v4.runtime.CharStream;
import org.antlr.v4.runtime.IntStream;
import org.antlr.v4.runtime.misc.Interval;

/**
 * A character stream over a {@link Reader} that holds only a window of the input: the characters
 * from the oldest mark (the lexer marks the start of each token) to what it has read ahead. It
 * does what ANTLR's UnbufferedCharStream does, at about twice the speed, since it reads the
 * Reader a block at a time and answers {@code LA(1)} from an array.
 *
 * <p>Characters are Unicode code points; surrogate pairs are joined. Bytes that are not UTF-8
 * are an {@link InputError} at the first bad byte; any other read failure leaves as an
 * UncheckedIOException, which the reader turns back into the IOException.
 */
final class ReaderCharStream implements CharStream {

    private static final int BLOCK = 1 << 16;

    private final String file;
    private final Reader reader;
    private final char[] block = new char[BLOCK];
    /** Code points; data[0] is the character at absolute index {@code start}. */
    private int[] data = new int[2 * BLOCK];
    private int start;
    private int count;
    private int p;
    private int marks;
    private int markedFrom;
    private boolean endOfInput;
    /** A high surrogate at the end of the last block, waiting for its partner. */
    private int pendingHigh = -1;
    /** The line of the last character read, and the index of that line's first character. */
    private int line = 1;
    private long lineStart;

    ReaderCharStream(String file, Reader reader) {
        this.file = file;
        this.reader = reader;
        this.ascii = reader instanceof Utf8 u ? u : null;
    }

    /** The reader, when it can hand out ASCII text as code points directly. */
    private final Utf8 ascii;

    @Override
    public int LA(int i) {
        if (i > 0) {
            int at = p + i - 1;
            while (at >= count) {
                if (!fill()) {
                    return IntStream.EOF;
                }
                at = p + i - 1;
            }
            return data[at];
        }
        if (i < 0 && p + i >= 0) {
            return data[p + i];
        }
        if (i == 0) {
            return 0;
        }
        throw new UnsupportedOperationException("the character before the window is gone");
    }

    @Override
    public void consume() {
        if (p >= count && !fill()) {
            throw new IllegalStateException("cannot consume EOF");
        }
        p++;
    }

    @Override
    public int mark() {
        if (marks == 0) {
            markedFrom = start + p;
        }
        marks++;
        return -marks;
    }

    @Override
    public void release(int marker) {
        if (marker != -marks) {
            throw new IllegalStateException("release() called with an invalid marker");
        }
        marks--;
    }

    /**
     * Releases {@code marker} and every mark made after it: for a caller whose inner marks may have been left unreleased
     * when the stack ran out.
     */
    void releaseFrom(int marker) {
        if (-marker > marks) {
            throw new IllegalStateException("releaseFrom() called with an invalid marker");
        }
        marks = -marker - 1;
    }

    @Override
    public int index() {
        return start + p;
    }

    @Override
    public void seek(int index) {
        while (index - start > count && fill()) {
            // read forward to the index
        }
        int at = index - start;
        if (at < 0 || at > count) {
            throw new UnsupportedOperationException("seek to " + index + " outside the window " + start + ".." + (start + count));
        }
        p = at;
    }

    @Override
    public int size() {
        throw new UnsupportedOperationException("a stream does not know its size");
    }

    @Override
    public String getSourceName() {
        return file;
    }

    @Override
    public String getText(Interval interval) {
        return textOf(interval.a, interval.b);
    }

    /** The text of characters {@code from..to}, which must be in the window (the current token). */
    String textOf(int from, int to) {
        int at = from - start;
        int length = Math.min(to, start + count - 1) - from + 1;
        return length <= 0 ? "" : new String(data, at, length);
    }

    /**
     * Consumes the characters of a name, {@code [A-Za-z0-9_]*} from here, and returns its text; {@link #nameType} is
     * then its token type ({@link FastLexer#nameType}). For both lexers: one pass over the characters both finds the
     * end and hashes them for the cache of recent names (names recur on every line: variables, symbols, rule
     * keywords), and a name found there needs neither a new string nor a keyword lookup.
     */
    String consumeName() {
        int length = 0;
        int h = 0;
        int kinds = 0;
        byte[] table = NAME_CHARS;
        while (true) {
            int[] d = data;
            int i = p + length;
            int end = count;
            while (i < end) {
                int c = d[i];
                int k;
                if (c >= 128 || (k = table[c]) == 0) {
                    break;
                }
                h = 31 * h + c;
                kinds |= k;
                i++;
            }
            length = i - p;
            if (i < end || !fill()) {
                break;
            }
        }
        boolean lower = kinds <= LOWER;
        String text;
        if (length > SHORT_NAME) {
            text = new String(latin1(p, length), StandardCharsets.ISO_8859_1);
            nameType = FastLexer.nameType(text, lower);
        } else {
            int slot = (h ^ (h >>> 11) ^ (h >>> 22)) & (names.length - 1);
            byte[] chars = nameChars[slot];
            if (nameHashes[slot] == h && chars != null && sameChars(chars, p, length)) {
                text = names[slot];
                nameType = nameTypes[slot];
            } else {
                byte[] copy = latin1(p, length);
                text = new String(copy, StandardCharsets.ISO_8859_1);
                // Hashed here, on the reading thread when it reads ahead: the checker looks every name up by it.
                text.hashCode();
                nameType = FastLexer.nameType(text, lower);
                names[slot] = text;
                nameHashes[slot] = h;
                nameChars[slot] = copy;
                nameTypes[slot] = nameType;
            }
        }
        p += length;
        return text;
    }

    /** The bytes of {@code length} name characters (all ASCII) from window index {@code at}. */
    private byte[] latin1(int at, int length) {
        byte[] b = new byte[length];
        for (int i = 0; i < length; i++) {
            b[i] = (byte) data[at + i];
        }
        return b;
    }

    /** The token type of the name {@link #consumeName} returned last. */
    int nameType;

    private static final int SHORT_NAME = 24;
    /** The characters of a name: 1 for a lower-case letter, 2 for the others ({@code [A-Z0-9_]}), 0 for the rest. */
    private static final byte LOWER = 1;
    private static final byte[] NAME_CHARS = new byte[128];

    static {
        for (int c = 'a'; c <= 'z'; c++) {
            NAME_CHARS[c] = LOWER;
        }
        for (int c = 'A'; c <= 'Z'; c++) {
            NAME_CHARS[c] = 2;
        }
        for (int c = '0'; c <= '9'; c++) {
            NAME_CHARS[c] = 2;
        }
        NAME_CHARS['_'] = 2;
    }

    private boolean sameChars(byte[] chars, int at, int length) {
        if (chars.length != length) {
            return false;
        }
        int[] d = data;
        for (int i = 0; i < length; i++) {
            if (chars[i] != d[at + i]) {
                return false;
            }
        }
        return true;
    }

    /** The cache of recent names: text, hash, characters and token type per slot. */
    private final String[] names = new String[4096];
    private final int[] nameHashes = new int[4096];
    private final byte[][] nameChars = new byte[4096][];
    private final int[] nameTypes = new int[4096];

    void close() throws IOException {
        reader.close();
    }

    /** Reads the next block into the window; false at the end of the input. */
    private boolean fill() {
        if (endOfInput) {
            return false;
        }
        int keep = marks > 0 ? Math.min(markedFrom - start, p) : p;
        if (keep > 0) {
            System.arraycopy(data, keep, data, 0, count - keep);
            start += keep;
            count -= keep;
            p -= keep;
        }
        if (data.length - count < BLOCK + 1) {
            data = Arrays.copyOf(data, Math.max(2 * data.length, count + BLOCK + 1));
        }
        if (ascii != null && pendingHigh < 0) {
            int n = readAscii();
            if (n > 0) {
                countLines(count, count + n);
                count += n;
                return true;
            }
        }
        int read;
        do {
            read = read();
        } while (read == 0);
        if (read < 0) {
            endOfInput = true;
            if (pendingHigh >= 0) {
                data[count++] = pendingHigh; // a lone surrogate: the lexer calls it an illegal character
                pendingHigh = -1;
                return true;
            }
            return false;
        }
        int added = count;
        int[] d = data;
        int n = count;
        for (int i = 0; i < read; i++) {
            char c = block[i];
            if (c < Character.MIN_SURROGATE && pendingHigh < 0) {
                d[n++] = c;
                continue;
            }
            if (pendingHigh >= 0) {
                if (Character.isLowSurrogate(c)) {
                    d[n++] = Character.toCodePoint((char) pendingHigh, c);
                    pendingHigh = -1;
                    continue;
                }
                d[n++] = pendingHigh;
                pendingHigh = -1;
            }
            if (Character.isHighSurrogate(c)) {
                pendingHigh = c;
                continue;
            }
            d[n++] = c;
        }
        countLines(count, n);
        count = n;
        return count > added || fill();
    }

    /**
     * Counts the lines of window indices {@code from..to} (exclusive): the line and column of the end, for the message
     * about bytes that are not UTF-8 that the next read may throw.
     */
    private void countLines(int from, int to) {
        int[] d = data;
        for (int i = from; i < to; i++) {
            if (d[i] == '\n') {
                line++;
                lineStart = start + i + 1;
            }
        }
    }

    private int readAscii() {
        try {
            return ascii.readAscii(data, count, BLOCK);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private int read() {
        try {
            return reader.read(block, 0, BLOCK);
        } catch (CharacterCodingException e) {
            int column = (int) (start + count - lineStart) + 1;
            throw new SyntaxFailure(new InputError(new Location(file, line, column), "the file is not valid UTF-8 text"));
        } catch (IOException e) {
            // Not a fault of the input: the reader's caller gets it as the IOException it is.
            throw new UncheckedIOException(e);
        }
    }
}
