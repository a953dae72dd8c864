package dev.assay.syntax;

/** One statement of a certificate file, in the order of the file. */
public sealed interface CertificateStatement permits CertificateHeader, Digest, Step, Forget {

    /** Where the statement's keyword is. */
    Location at();
}
