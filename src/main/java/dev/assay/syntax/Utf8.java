package dev.assay.syntax;

import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/** Opens files as strict UTF-8: a malformed byte is an error, not a silent replacement character. */
final class Utf8 {

    private Utf8() {
    }

    static Reader open(Path file) throws IOException {
        return new InputStreamReader(Files.newInputStream(file), StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT));
    }
}
