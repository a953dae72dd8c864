package dev.assay.syntax;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.MalformedInputException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Reads a file as strict UTF-8: a malformed byte is an error, not a silent replacement character.
 * Unlike an InputStreamReader, which drops the characters it decoded before a bad byte, this one
 * hands them out first and fails on the next read, so the error's line and column are the bad
 * byte's.
 */
final class Utf8 extends Reader {

    private final InputStream in;
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPORT)
            .onUnmappableCharacter(CodingErrorAction.REPORT);
    private final ByteBuffer bytes = ByteBuffer.allocate(1 << 16);
    private boolean endOfBytes;
    private boolean flushed;
    private CoderResult error;

    private Utf8(InputStream in) {
        this.in = in;
        bytes.flip();
    }

    static Reader open(Path file) throws IOException {
        return new Utf8(Files.newInputStream(file));
    }

    static Reader of(InputStream in) {
        return new Utf8(in);
    }

    @Override
    public int read(char[] buffer, int offset, int length) throws IOException {
        if (length == 0) {
            return 0;
        }
        CharBuffer out = CharBuffer.wrap(buffer, offset, length);
        while (out.position() == offset) {
            if (error != null) {
                throw new MalformedInputException(error.length());
            }
            if (flushed) {
                return -1;
            }
            refill();
            CoderResult result = decoder.decode(bytes, out, endOfBytes);
            if (result.isError()) {
                error = result;
            } else if (endOfBytes && result.isUnderflow() && !bytes.hasRemaining()) {
                decoder.flush(out);
                flushed = true;
            }
        }
        return out.position() - offset;
    }

    /**
     * Copies the ASCII bytes that come next, up to {@code length}, into {@code out} as code points, and returns how
     * many; 0 when the next byte is not ASCII, an error is pending or the input has ended, in which case
     * {@link #read(char[], int, int)} takes over. The fast path for text that is ASCII, which most files are: an ASCII
     * byte is always a whole UTF-8 character, so nothing the decoder holds is skipped.
     */
    int readAscii(int[] out, int offset, int length) throws IOException {
        if (error != null || flushed) {
            return 0;
        }
        refill();
        byte[] b = bytes.array();
        int at = bytes.position();
        int end = Math.min(bytes.limit(), at + length);
        int i = at;
        while (i < end && b[i] >= 0) {
            out[offset++] = b[i++];
        }
        bytes.position(i);
        return i - at;
    }

    /** Reads more bytes when fewer than a whole character's worth are left. */
    private void refill() throws IOException {
        if (endOfBytes || bytes.remaining() >= 4) {
            return;
        }
        bytes.compact();
        int n = in.read(bytes.array(), bytes.position(), bytes.remaining());
        if (n < 0) {
            endOfBytes = true;
        } else {
            bytes.position(bytes.position() + n);
        }
        bytes.flip();
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
