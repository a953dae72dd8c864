package dev.assay.syntax;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import org.antlr.v4.runtime.UnbufferedCharStream;

/**
 * An unbuffered character stream that reads its {@link Reader} a block at a time instead of a
 * {@code read()} call per character, and turns a read failure into an {@link InputError} at the
 * place where it happened (for a file that is not UTF-8, the first bad byte).
 */
final class ReaderCharStream extends UnbufferedCharStream {

    private final String file;
    private final Reader reader;
    private final char[] block = new char[1 << 16];
    private int next;
    private int limit;
    private int line = 1;
    private int column = 1;

    ReaderCharStream(String file, Reader reader) {
        // The superclass constructor that takes a Reader reads a character at once, before this
        // class's fields exist; this one reads nothing. The first LA(1) fills the buffer.
        super(4096);
        this.file = file;
        this.reader = reader;
        this.name = file;
    }

    @Override
    protected int nextChar() {
        if (next == limit) {
            try {
                limit = reader.read(block, 0, block.length);
            } catch (CharacterCodingException e) {
                throw new SyntaxFailure(new InputError(new Location(file, line, column),
                        "the file is not valid UTF-8 text"));
            } catch (IOException e) {
                throw new SyntaxFailure(new InputError(new Location(file, line, column),
                        "cannot read the file: " + e.getMessage()));
            }
            next = 0;
            if (limit <= 0) {
                limit = 0;
                return -1;
            }
        }
        char c = block[next++];
        if (c == '\n') {
            line++;
            column = 1;
        } else if (!Character.isLowSurrogate(c)) {
            column++;
        }
        return c;
    }

    /** The text of characters {@code start..stop}, which must still be in the buffer (the current token). */
    String textOf(int start, int stop) {
        int from = start - getBufferStartIndex();
        return new String(data, from, stop - start + 1);
    }

    int hashOf(int start, int stop) {
        int from = start - getBufferStartIndex();
        int hash = 0;
        for (int i = from, end = from + stop - start; i <= end; i++) {
            hash = 31 * hash + data[i];
        }
        return hash;
    }

    /** Whether characters {@code start..stop} spell {@code text}, which has no surrogate pairs. */
    boolean spells(String text, int start, int stop) {
        if (text.length() != stop - start + 1) {
            return false;
        }
        int from = start - getBufferStartIndex();
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) != data[from + i]) {
                return false;
            }
        }
        return true;
    }

    void close() throws IOException {
        reader.close();
    }
}
