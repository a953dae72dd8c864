package dev.assay.syntax;

/** Carries an {@link InputError} out through ANTLR's generated code, which only lets unchecked exceptions pass. */
final class SyntaxFailure extends RuntimeException {

    final InputError error;

    SyntaxFailure(InputError error) {
        super(error.getMessage(), error, false, false);
        this.error = error;
    }
}
