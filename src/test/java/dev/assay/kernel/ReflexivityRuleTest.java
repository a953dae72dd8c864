package dev.assay.kernel;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** {@code reflexivity} (FORMAT.md section 6, rules on clauses): the conclusion is {@code t = t} for some term t. */
class ReflexivityRuleTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("b", 0);
        k.function("f", 1);
        k.function("m", 2);
        k.predicate("P", 1);
        start();
    }

    @Test
    void groundTerms() {
        accepted(reflexivity("a = a"));
        accepted(reflexivity("f(m(a, b)) = f(m(a, b))"));
    }

    @Test
    void nonGroundTerms() {
        accepted(reflexivity("[x] x = x"));
        accepted(reflexivity("[x, y] m(x, f(y)) = m(x, f(y))"));
    }

    @Test
    void theSameLiteralWrittenTwiceIsOneLiteral() {
        accepted(reflexivity("a = a or a = a"));
    }

    @Test
    void differentSides() {
        rejected(reflexivity("a = b"), "reflexivity", "reflexivity concludes a single equation t = t");
        rejected(reflexivity("[x, y] x = y"), "reflexivity", "reflexivity concludes a single equation t = t");
        rejected(reflexivity("[x, y] f(x) = f(y)"), "reflexivity", "a single equation t = t");
        rejected(reflexivity("[x] x = f(x)"), "reflexivity", "a single equation t = t");
    }

    @Test
    void twoLiterals() {
        rejected(reflexivity("a = a or b = b"), "reflexivity", "reflexivity concludes a single equation t = t");
        rejected(reflexivity("a = a or P(a)"), "reflexivity", "a single equation t = t");
    }

    @Test
    void notAPositiveEquation() {
        rejected(reflexivity("a != a"), "reflexivity", "a single equation t = t");
        rejected(reflexivity("P(a)"), "reflexivity", "a single equation t = t");
        rejected(reflexivity("false"), "reflexivity", "a single equation t = t");
    }

    @Test
    void unknownSymbol() {
        k.function("zz", 0);
        rejected(reflexivity("zz = zz"), "reflexivity", "the symbol zz/0 is not in the signature");
    }
}
