package dev.assay.syntax;

import static dev.assay.syntax.Parse.formula;
import static dev.assay.syntax.Parse.formulaError;
import static dev.assay.syntax.Parse.showFormula;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Terms, atoms and the precedence, associativity and scope rules of formulas (FORMAT.md §2). */
class FormulaSyntaxTest {

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            P                                    | P
            P(x)                                 | P(x)
            Holds(p, badge(p))                   | Holds(p,badge(p))
            f(g(a), b) = c                       | (= f(g(a),b) c)
            a != b                               | (!= a b)
            a ≠ b                                | (!= a b)
            true                                 | true
            false                                | false
            not P                                | (not P)
            not not P                            | (not (not P))
            not a = b                            | (not (= a b))
            a and b and c                        | (and a b c)
            a or b or c                          | (or a b c)
            a or b and c                         | (or a (and b c))
            a and b or c                         | (or (and a b) c)
            not a and b                          | (and (not a) b)
            a implies b implies c                | (implies a (implies b c))
            a or b implies c and d               | (implies (or a b) (and c d))
            a implies b iff c implies d          | (iff (implies a b) (implies c d))
            a iff b                              | (iff a b)
            (a iff b) iff c                      | (iff (iff a b) c)
            a iff (b iff c)                      | (iff a (iff b c))
            (a and b) and c                      | (and (and a b) c)
            (a implies b) implies c              | (implies (implies a b) c)
            ((((P))))                            | P
            forall x. P(x)                       | (forall x P(x))
            forall x y. R(x, y)                  | (forall x y R(x,y))
            forall x. P(x) and Q(x)              | (forall x (and P(x) Q(x)))
            forall x. P(x) implies Q(x) iff R    | (forall x (iff (implies P(x) Q(x)) R))
            exists x. forall y. R(x, y)          | (exists x (forall y R(x,y)))
            (forall x. P(x)) and Q               | (and (forall x P(x)) Q)
            a and forall x. P(x) or Q(x)         | (and a (forall x (or P(x) Q(x))))
            a or forall x. P(x) and Q(x) or R    | (or a (forall x (or (and P(x) Q(x)) R)))
            not forall x. P(x)                   | (not (forall x P(x)))
            not forall x. P(x) or Q              | (not (forall x (or P(x) Q)))
            forall x. not P(x) or Q              | (forall x (or (not P(x)) Q))
            a implies forall x. b implies c      | (implies a (forall x (implies b c)))
            a iff forall x. b iff c              | (iff a (forall x (iff b c)))
            (a and forall x. b) or c             | (or (and a (forall x b)) c)
            P(x) and (forall x. Q(x)) or R       | (or (and P(x) (forall x Q(x))) R)
            """)
    void precedenceAssociativityAndScope(String text, String expected) throws InputError {
        assertEquals(expected, showFormula(text));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            ∀x. ¬P(x) ∨ Q(x)                      | forall x. not P(x) or Q(x)
            ∃y. P(y) ∧ ⊤                          | exists y. P(y) and true
            a → b ↔ ¬c                           | a implies b iff not c
            ⊥ ∨ a ≠ b                            | false or a != b
            ∀x. ∀y. P(x) → P(y)                  | forall x. forall y. P(x) implies P(y)
            """)
    void unicodeSpellingsMeanTheirKeywords(String unicode, String ascii) throws InputError {
        assertEquals(showFormula(ascii), showFormula(unicode));
    }

    @Test
    void iffIsNotAssociative() {
        InputError error = formulaError("a iff b iff c");
        assertEquals("t.problem:2:18: 'iff' is not associative: write parentheses, as in (a iff b) iff c",
                error.getMessage());
    }

    @Test
    void aQuantifiedBodyDoesNotMakeAnIffChainAssociative() {
        // The body takes `a iff b`; the second `iff` would chain onto it.
        assertEquals("t.problem:2:28: 'iff' is not associative: write parentheses, as in (a iff b) iff c",
                formulaError("forall x. a iff b iff c").getMessage());
        assertEquals("t.problem:2:32: 'iff' is not associative: write parentheses, as in (a iff b) iff c",
                formulaError("p and forall x. a ↔ b ↔ c").getMessage());
    }

    @Test
    void locationsAreWhereEachNodeStarts() throws InputError {
        // axiom a: forall x. not P(x) or x = f(c)
        //          10        20        30
        RawQuantified q = assertInstanceOf(RawQuantified.class, formula("forall x. not P(x) or x = f(c)"));
        assertEquals(new Location("t.problem", 2, 10), q.at());
        assertEquals(new Location("t.problem", 2, 17), q.variables().get(0).at());
        RawOr or = assertInstanceOf(RawOr.class, q.body());
        assertEquals(new Location("t.problem", 2, 20), or.at());
        RawNot not = assertInstanceOf(RawNot.class, or.operands().get(0));
        assertEquals(new Location("t.problem", 2, 20), not.at());
        RawAtom p = assertInstanceOf(RawAtom.class, not.body());
        RawTerm px = ((RawPredicateAtom) p.atom()).term();
        assertEquals(new Location("t.problem", 2, 24), px.at());
        assertEquals(new Location("t.problem", 2, 26), px.args().get(0).at());
        RawEquation eq = assertInstanceOf(RawEquation.class, ((RawAtom) or.operands().get(1)).atom());
        assertEquals(new Location("t.problem", 2, 32), eq.at());
        assertEquals(new Location("t.problem", 2, 36), eq.right().at());
    }

    @Test
    void columnsCountCodePoints() {
        // ∀, ¬ and ∧ are one column each; the error is at the `)` in column 22.
        assertEquals("t.problem:2:22: expected a formula, found ')'", formulaError("∀x. ¬P(x) ∧ )").getMessage());
    }

    @Test
    void aBareNameIsATermWithoutArguments() throws InputError {
        RawAtom atom = assertInstanceOf(RawAtom.class, formula("Raining"));
        RawTerm term = ((RawPredicateAtom) atom.atom()).term();
        assertEquals("Raining", term.name());
        assertEquals(0, term.args().size());
    }

    @Test
    void emptyArgumentListsAreNotTerms() {
        assertEquals("t.problem:2:12: expected a term, found ')'", formulaError("f() = c").getMessage());
    }

    @Test
    void identifiersThatStartWithAKeywordAreNames() throws InputError {
        assertEquals("(and android (or oracle notable))", showFormula("android and (oracle or notable)"));
        assertEquals("forall_(x)", showFormula("forall_(x)"));
    }

    @Test
    void commentsAndLineBreaksSeparateTokens() throws InputError {
        assertEquals("(or P(x) Q)", showFormula("P( # the argument follows\n x) or\n\n   # and another disjunct\nQ"));
    }
}
