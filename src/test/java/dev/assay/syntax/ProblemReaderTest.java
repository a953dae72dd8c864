package dev.assay.syntax;

import static dev.assay.syntax.Parse.problemError;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Problem files (FORMAT.md §3 and §4). */
class ProblemReaderTest {

    @Test
    void readsTheExampleOfTheFormat() throws InputError {
        String text = """
                problem badge_rule
                axiom issued: forall p. Staff(p) implies exists b. Holds(p, b)
                axiom ann_staff: Staff(ann)
                goal ann_badge: exists b. Holds(ann, b)
                """;
        List<ProblemStatement> statements = ProblemReader.readAll("badge.problem", text);
        assertEquals(4, statements.size());
        ProblemHeader header = assertInstanceOf(ProblemHeader.class, statements.get(0));
        assertEquals("badge_rule", header.name().text());
        assertEquals(new Location("badge.problem", 1, 9), header.name().at());
        Axiom issued = assertInstanceOf(Axiom.class, statements.get(1));
        assertEquals("issued", issued.name().text());
        assertEquals(new Location("badge.problem", 2, 1), issued.at());
        assertEquals(new Location("badge.problem", 2, 7), issued.name().at());
        assertEquals("(forall p (implies Staff(p) (exists b Holds(p,b))))", Show.formula(issued.formula()));
        Axiom staff = assertInstanceOf(Axiom.class, statements.get(2));
        assertEquals("Staff(ann)", Show.formula(staff.formula()));
        Goal goal = assertInstanceOf(Goal.class, statements.get(3));
        assertEquals("ann_badge", goal.name().text());
        assertEquals("(exists b Holds(ann,b))", Show.formula(goal.formula()));
    }

    @Test
    void declarationsListNamesWithArities() throws InputError {
        List<ProblemStatement> statements = ProblemReader.readAll("t.problem",
                "problem t\ndeclare function f/2, c/0\ndeclare predicate Holds/2 , Raining/0\naxiom a: Raining");
        Declaration functions = assertInstanceOf(Declaration.class, statements.get(1));
        assertEquals(DeclarationKind.FUNCTION, functions.kind());
        assertEquals(new Location("t.problem", 2, 1), functions.at());
        assertEquals("f", functions.symbols().get(0).name().text());
        assertEquals(2, functions.symbols().get(0).arity());
        assertEquals(new Location("t.problem", 2, 18), functions.symbols().get(0).at());
        assertEquals("c", functions.symbols().get(1).name().text());
        assertEquals(0, functions.symbols().get(1).arity());
        Declaration predicates = assertInstanceOf(Declaration.class, statements.get(2));
        assertEquals(DeclarationKind.PREDICATE, predicates.kind());
        assertEquals(List.of("Holds", "Raining"), predicates.symbols().stream().map(s -> s.name().text()).toList());
    }

    @Test
    void statementsMayComeInAnyOrderAfterTheHeader() throws InputError {
        List<ProblemStatement> statements = ProblemReader.readAll("t.problem",
                "problem t\ngoal g: P\naxiom a: Q\ndeclare predicate P/0\naxiom b: P");
        assertEquals(5, statements.size());
    }

    @Test
    void aProblemNeedNotHaveAGoalOrAxioms() throws InputError {
        assertEquals(1, ProblemReader.readAll("t.problem", "problem t # nothing to prove\n").size());
    }

    @Test
    void theHeaderComesFirstAndOnce() {
        assertEquals("t.problem:1:1: a problem file starts with 'problem <name>'",
                problemError("axiom a: P").getMessage());
        assertEquals("t.problem:1:1: a problem file starts with 'problem <name>', found end of file",
                problemError("").getMessage());
        assertEquals("t.problem:3:1: a problem file has one 'problem' line (first declared at t.problem:1:1)",
                problemError("problem t\naxiom a: P\nproblem u").getMessage());
    }

    @Test
    void thereIsAtMostOneGoal() {
        InputError error = problemError("problem t\ngoal g: P\naxiom a: Q\ngoal h: R");
        assertEquals("t.problem:4:1: a problem has at most one goal (first declared at t.problem:2:1)", error.getMessage());
        assertEquals("a problem has at most one goal", error.reason());
        assertEquals(new Location("t.problem", 4, 1), error.at());
        assertEquals(new Location("t.problem", 2, 1), error.firstDeclared());
    }

    @Test
    void certificateStatementsAreNotProblemStatements() {
        assertEquals("t.problem:2:1: expected 'problem', 'declare', 'axiom', 'goal' or end of file, found 'step'",
                problemError("problem t\nstep c: clause P by reflexivity").getMessage());
    }
}
