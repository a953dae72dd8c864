package dev.assay.syntax;

import static dev.assay.syntax.Parse.certificateError;
import static dev.assay.syntax.Parse.showStep;
import static dev.assay.syntax.Parse.step;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Certificate statements and the arguments of every rule (FORMAT.md §5 and §6). */
class CertificateReaderTest {

    private static final String DIGITS = "0123456789abcdef".repeat(4);

    @Test
    void readsTheExampleOfTheFormat() throws Exception {
        String text = """
                certificate for badge_rule
                step g1: formula forall b. not Holds(ann, b)                   by negate ann_badge
                step a1: formula forall p. not Staff(p) or Holds(p, badge(p))    by skolemize issued fresh badge
                step c1: clause [p] not Staff(p) or Holds(p, badge(p))           by clausify a1
                step c2: clause Staff(ann)                                       by clausify ann_staff
                step c3: clause [b] not Holds(ann, b)                            by clausify g1
                step c4: clause Holds(ann, badge(ann))                           by resolve c1.1, c2.1
                step c5: clause false                                            by resolve c3.1, c4.1
                """;
        List<CertificateStatement> statements = CertificateReader.readAll("badge.proof", text);
        assertEquals(8, statements.size());
        CertificateHeader header = assertInstanceOf(CertificateHeader.class, statements.get(0));
        assertEquals("badge_rule", header.problem().text());
        assertEquals(new Location("badge.proof", 1, 17), header.problem().at());
        String[] expected = {
            "g1: formula (forall b (not Holds(ann,b))) by negate ann_badge",
            "a1: formula (forall p (or (not Staff(p)) Holds(p,badge(p)))) by skolemize issued fresh badge",
            "c1: clause [p] ~Staff(p) | Holds(p,badge(p)) by clausify a1 -",
            "c2: clause Staff(ann) by clausify ann_staff -",
            "c3: clause [b] ~Holds(ann,b) by clausify g1 -",
            "c4: clause Holds(ann,badge(ann)) by resolve c1.1 - c2.1 -",
            "c5: clause false by resolve c3.1 - c4.1 -",
        };
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i], Show.step((Step) statements.get(i + 1)));
        }
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            g: formula not G by negate goal1                              | g: formula (not G) by negate goal1
            n: formula P by nnf a1                                        | n: formula P by nnf a1
            s: formula P(c) by skolemize a1 fresh c                       | s: formula P(c) by skolemize a1 fresh c
            s: formula P(c, d) by skolemize a1 fresh c, d                 | s: formula P(c,d) by skolemize a1 fresh c,d
            s: formula P by skolemize a1                                  | 's: formula P by skolemize a1 fresh '
            c: clause P(x) by clausify a1                                 | c: clause P(x) by clausify a1 -
            c: clause P(a) by clausify a1 {x := a}                        | c: clause P(a) by clausify a1 {x:=a}
            c: clause P(a) by clausify a1 {}                              | c: clause P(a) by clausify a1 {}
            d: formula forall x. (Q(x) iff P(x)) by define fresh Q        | d: formula (forall x (iff Q(x) P(x))) by define fresh Q
            b: formula Q(a) by abbreviate a1 using d                      | b: formula Q(a) by abbreviate a1 using d
            r: clause Q by resolve c1.1, c2.3                             | r: clause Q by resolve c1.1 - c2.3 -
            r: clause Q by resolve c1.1 {x := a}, c2.3                    | r: clause Q by resolve c1.1 {x:=a} c2.3 -
            r: clause Q by resolve c1.1, c2.3 {y := f(z)}                 | r: clause Q by resolve c1.1 - c2.3 {y:=f(z)}
            r: clause Q by resolve c1.1 {x := a, y := b}, c1.2 {}         | r: clause Q by resolve c1.1 {x:=a,y:=b} c1.2 {}
            f: clause P(x) by factor c1.1, c1.2                           | f: clause P(x) by factor c1.1 c1.2 -
            f: clause P(a) by factor c1.1, c1.2 {x := a}                  | f: clause P(a) by factor c1.1 c1.2 {x:=a}
            i: clause P(a) by instantiate c1 {x := a}                     | i: clause P(a) by instantiate c1 {x:=a}
            i: clause P(x) by instantiate c1 {}                           | i: clause P(x) by instantiate c1 {}
            p: clause P(b) by paramodulate c1.1 -> c2.1 @ 1               | p: clause P(b) by paramodulate c1.1 -> c2.1 @ 1 - -
            p: clause P(b) by paramodulate c1.1 <- c2.1 @ 1.2.3           | p: clause P(b) by paramodulate c1.1 <- c2.1 @ 1.2.3 - -
            p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {x := a}      | p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {x:=a} -
            p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {} {y := a}   | p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {} {y:=a}
            p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {x:=a} {y:=b} | p: clause P(b) by paramodulate c1.1 -> c2.1 @ 2 {x:=a} {y:=b}
            e: clause P by eqres c1.2                                     | e: clause P by eqres c1.2 -
            e: clause P by eqres c1.2 {x := a}                            | e: clause P by eqres c1.2 {x:=a}
            q: clause [x] a != x by eqfactor c1.1, c1.2                   | q: clause [x] (!= a x) by eqfactor c1.1 c1.2 -
            q: clause a != b by eqfactor c1.1, c1.2 {x := b}              | q: clause (!= a b) by eqfactor c1.1 c1.2 {x:=b}
            t: clause [x] x = x by reflexivity                            | t: clause [x] (= x x) by reflexivity
            """)
    void everyRuleParsesWithItsArguments(String text, String expected) throws Exception {
        assertEquals(expected, showStep(text));
    }

    @Test
    void ruleArgumentsAreTypedAndLocated() throws Exception {
        // step p: clause P(b) by paramodulate c1.1 -> c2.1 @ 1.2 {x := a}
        // columns: p 6, paramodulate 24, c1.1 37, c2.1 45, 1.2 52, { 56
        Step step = step("p: clause P(b) by paramodulate c1.1 -> c2.1 @ 1.2 {x := a}");
        assertEquals("p", step.label().text());
        assertEquals(new Location("t.proof", 2, 6), step.label().at());
        assertEquals(new Location("t.proof", 2, 1), step.at());
        assertEquals("paramodulate", step.rule().text());
        assertEquals(new Location("t.proof", 2, 24), step.rule().at());
        ParamodulateArgs args = assertInstanceOf(ParamodulateArgs.class, step.args());
        assertEquals("paramodulate", args.ruleName());
        assertEquals("c1", args.from().label().text());
        assertEquals(1, args.from().index());
        assertEquals(new Location("t.proof", 2, 37), args.from().at());
        assertEquals(Direction.LEFT_TO_RIGHT, args.direction());
        assertEquals(new Location("t.proof", 2, 45), args.into().at());
        assertEquals(List.of(1, 2), args.position().path());
        assertEquals(new Location("t.proof", 2, 52), args.position().at());
        assertEquals("x", args.fromSubst().bindings().get(0).variable().text());
        assertEquals(new Location("t.proof", 2, 56), args.fromSubst().at());
        assertNull(args.intoSubst());
    }

    @Test
    void clausesKeepTheirBracketLiteralsAndOrder() throws Exception {
        RawClause clause = assertInstanceOf(RawClause.class,
                step("c: clause [x, y] not P(x) or x = y or not f(x) != y or Q by reflexivity").conclusion());
        assertEquals(List.of("x", "y"), clause.variables().stream().map(Name::text).toList());
        assertEquals("[x y] ~P(x) | (= x y) | ~(!= f(x) y) | Q", Show.clause(clause));
        assertTrue(clause.hasVariableBracket());
        RawClause unbracketed = (RawClause) step("c: clause P(a) by reflexivity").conclusion();
        assertNull(unbracketed.variables());
        RawClause empty = (RawClause) step("c: clause ⊥ by reflexivity").conclusion();
        assertTrue(empty.isEmptyClause());
        assertNull(empty.variables());
    }

    @Test
    void forgetListsLabels() throws Exception {
        List<CertificateStatement> statements = CertificateReader.readAll("t.proof",
                "certificate for t\nstep c1: clause P by reflexivity\nforget c1, c2,c3");
        Forget forget = assertInstanceOf(Forget.class, statements.get(2));
        assertEquals(List.of("c1", "c2", "c3"), forget.labels().stream().map(Name::text).toList());
        assertEquals(new Location("t.proof", 3, 1), forget.at());
        assertEquals(new Location("t.proof", 3, 12), forget.labels().get(1).at());
    }

    @Test
    void aDigestIsSixtyFourHexDigitsInEitherCase() throws Exception {
        List<CertificateStatement> statements = CertificateReader.readAll("t.proof",
                "certificate for t\ndigest \"sha256:" + DIGITS.toUpperCase() + "\"\nstep c: clause P by reflexivity");
        Digest digest = assertInstanceOf(Digest.class, statements.get(1));
        assertEquals(DIGITS, digest.sha256());
        assertEquals(new Location("t.proof", 2, 1), digest.at());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            "sha256:abc"                  | t.proof:2:8: a SHA-256 digest has 64 hexadecimal digits, found 3
            "md5:abc"                     | t.proof:2:8: a digest is written "sha256:" and 64 hexadecimal digits, found "md5:abc"
            "SHA256:abc"                  | t.proof:2:8: a digest is written "sha256:" and 64 hexadecimal digits, found "SHA256:abc"
            "sha256:12g4"                 | t.proof:2:18: a digest has only hexadecimal digits, found 'g' (U+0067)
            "sha256:"                     | t.proof:2:8: a SHA-256 digest has 64 hexadecimal digits, found 0
            "sha256:abc                   | t.proof:2:8: unterminated string: a string ends with '"' on the line where it starts
            sha256:abc                    | t.proof:2:8: expected a string "sha256:...", found 'sha256'
            """)
    void malformedDigestsAreInputErrors(String digest, String message) {
        assertEquals(message, certificateError("certificate for t\ndigest " + digest + "\n").getMessage());
    }

    @Test
    void aDigestOfTheWrongLengthIsAnError() {
        String tooLong = "certificate for t\ndigest \"sha256:" + DIGITS + "0\"";
        assertEquals("t.proof:2:8: a SHA-256 digest has 64 hexadecimal digits, found 65",
                certificateError(tooLong).getMessage());
    }

    @Test
    void theHeaderComesFirstAndOnce() {
        assertEquals("t.proof:1:1: a certificate starts with 'certificate for <problem name>'",
                certificateError("step c: clause P by reflexivity").getMessage());
        assertEquals("t.proof:1:1: a certificate starts with 'certificate for <problem name>', found end of file",
                certificateError("").getMessage());
        assertEquals("t.proof:3:1: a certificate starts with 'certificate for <problem name>', found end of file",
                certificateError("# nothing but\n# comments\n").getMessage());
        InputError twice = certificateError("certificate for t\nstep c: clause P by reflexivity\ncertificate for u");
        assertEquals("t.proof:3:1: a certificate has one 'certificate for' line (first declared at t.proof:1:1)",
                twice.getMessage());
        assertEquals(new Location("t.proof", 1, 1), twice.firstDeclared());
    }

    @Test
    void theDigestComesRightAfterTheHeaderAndOnce() {
        String digest = "digest \"sha256:" + DIGITS + "\"";
        assertEquals("t.proof:3:1: the digest comes right after the 'certificate for' line",
                certificateError("certificate for t\nstep c: clause P by reflexivity\n" + digest).getMessage());
        assertEquals("t.proof:3:1: a certificate has at most one digest (first declared at t.proof:2:1)",
                certificateError("certificate for t\n" + digest + "\n" + digest).getMessage());
    }

    @Test
    void statementsComeOneAtATimeAndThenNull() throws Exception {
        CertificateReader reader = new CertificateReader("t.proof",
                new StringReader("certificate for t\nstep a: clause P by reflexivity\nstep b: clause Q by reflexivity"));
        assertInstanceOf(CertificateHeader.class, reader.next());
        assertEquals("a", ((Step) reader.next()).label().text());
        assertEquals("b", ((Step) reader.next()).label().text());
        assertNull(reader.next());
        assertNull(reader.next());
    }

    @Test
    void afterAnErrorTheReaderRepeatsIt() throws Exception {
        CertificateReader reader = new CertificateReader("t.proof",
                new StringReader("certificate for t\nstep a clause P by reflexivity\nstep b: clause Q by reflexivity"));
        reader.next();
        InputError first = assertThrows(InputError.class, reader::next);
        InputError again = assertThrows(InputError.class, reader::next);
        assertEquals(first.getMessage(), again.getMessage());
        assertEquals("t.proof:2:8: expected ':' after the step label, found 'clause'", first.getMessage());
    }
}
