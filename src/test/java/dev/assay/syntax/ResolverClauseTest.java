package dev.assay.syntax;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Kernel;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Signature;
import dev.assay.kernel.TermFactory;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Names in a clause conclusion: which are variables (those the bracket lists), and the messages for a bracket that
 * lists a name twice or a name that does not occur, for a variable applied to arguments or standing as an atom, with
 * brackets of a few names and of more than the resolver keeps without an index.
 */
class ResolverClauseTest {

    private final TermFactory terms = new TermFactory();
    private final Resolver resolver = new Resolver(terms);
    private final Signature signature;

    ResolverClauseTest() throws Exception {
        String problem = "problem lab\naxiom a: forall x y. Rack(x, y) or Tray(tube(x))\n";
        List<ProblemStatement> statements = new ArrayList<>();
        try (ProblemReader r = new ProblemReader("lab.problem", new StringReader(problem))) {
            for (ProblemStatement s = r.next(); s != null; s = r.next()) statements.add(s);
        }
        signature = new Kernel(resolver.problem(statements), terms).signature();
    }

    private RawClause raw(String clause) throws Exception {
        String text = "certificate for lab\nstep s: clause " + clause + " by clausify a\n";
        try (CertificateReader r = new CertificateReader("lab.proof", new StringReader(text))) {
            r.next();
            return (RawClause) ((Step) r.next()).conclusion();
        }
    }

    private Clause clause(String text) throws Exception {
        return resolver.stepClause(raw(text), signature);
    }

    private StepProblem problem(String text) throws Exception {
        RawClause c = raw(text);
        return assertThrows(StepProblem.class, () -> resolver.stepClause(c, signature));
    }

    /** {@code n} variables v0 … v(n-1) in a bracket, and a clause of Rack literals that uses those not skipped. */
    private static String wide(int n, int skipped) {
        StringBuilder bracket = new StringBuilder("[");
        StringBuilder body = new StringBuilder();
        for (int i = 0; i < n; i++) {
            bracket.append(i == 0 ? "" : ", ").append('v').append(i);
            if (i == skipped) continue;
            body.append(body.length() == 0 ? "" : " or ").append("Rack(v").append(i).append(", tube(v").append(i).append("))");
        }
        return bracket + "] " + body;
    }

    @Test
    void bracketedNamesAreVariablesAndOthersSymbols() throws Exception {
        Clause c = clause("[x] Rack(x, tube(x)) or not Tray(x)");
        assertEquals("[x] Rack(x, tube(x)) or not Tray(x)", Printer.clause(c));
        assertSame(terms.variable("x"), c.variables().get(0));
        assertEquals(1, c.variables().size());
        for (int n : new int[] {15, 16, 17, 40}) {
            Clause w = clause(wide(n, -1));
            assertEquals(n, w.variables().size(), n + " variables");
            assertEquals(n, w.width());
        }
    }

    @Test
    void aNameListedTwiceIsRefusedWhereItIsListedAgain() throws Exception {
        StepProblem p = problem("[x, y, x] Rack(x, y)");
        assertEquals("the variable x is listed twice", p.reason());
        assertEquals("step s: clause [x, y, ".length() + 1, p.at().column());
        StepProblem many = problem(wide(20, -1).replace("[v0, ", "[v0, v19, "));
        assertEquals("the variable v19 is listed twice", many.reason());
    }

    @Test
    void aListedNameThatDoesNotOccurIsRefusedAtItsPlaceInTheBracket() throws Exception {
        StepProblem p = problem("[x, y, z] Rack(x, y)");
        assertEquals("the variable z is listed but does not occur in the clause", p.reason());
        assertEquals(2, p.at().line());
        assertEquals("step s: clause [x, y, ".length() + 1, p.at().column());
        for (int n : new int[] {5, 16, 17, 30}) {
            StepProblem q = problem(wide(n, n - 2));
            assertEquals("the variable v" + (n - 2) + " is listed but does not occur in the clause", q.reason(), n + "");
        }
        // Of two that do not occur, the first listed is named.
        assertEquals("the variable y is listed but does not occur in the clause", problem("[x, y, z] Tray(x)").reason());
    }

    @Test
    void aVariableIsNeitherAppliedNorAnAtom() throws Exception {
        assertEquals("x is a variable here and cannot be applied to arguments",
                problem("[x] Tray(tube(x(x)))").reason());
        assertEquals("x is a variable here and cannot stand as an atom", problem("[x] x or Tray(x)").reason());
        // Without a bracket the same name is a symbol, and an unknown one.
        assertThrows(StepProblem.class, () -> clause("Tray(tube(x))"));
    }
}
