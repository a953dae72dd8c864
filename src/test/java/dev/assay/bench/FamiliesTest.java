package dev.assay.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Verdict;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.UnaryOperator;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** Every generated family verifies as theorem at small sizes, with and without forget, and a corrupted one does not. */
class FamiliesTest {

    @TempDir
    Path dir;

    static List<String> generated() {
        List<String> names = new ArrayList<>(Families.names());
        names.remove(Families.CORPUS);
        return names;
    }

    private static CheckResult check(Families.Member m) {
        return new Checker().check(m.problem(), m.proof());
    }

    @ParameterizedTest
    @MethodSource("generated")
    void everySizeFromTheSmallestIsATheoremWithExactlyThatManySteps(String name) throws IOException {
        Family f = Families.family(name);
        long min = f.minSteps();
        List<Long> sizes = new ArrayList<>();
        for (long n = min; n < min + 5; n++) sizes.add(n);
        sizes.add(min * 2 + 40);
        for (long n : sizes) {
            // Forget lines only change the largest member: the small ones have few rounds to forget.
            for (boolean forget : n == sizes.get(sizes.size() - 1) ? new boolean[] {false, true} : new boolean[] {false}) {
                Families.Member m = Families.generate(f, n, forget, true, dir.resolve(forget ? "f" : "k"));
                CheckResult r = check(m);
                assertEquals(Verdict.THEOREM, r.verdict(), name + " at " + n + " steps" + (forget ? " with forget" : "")
                        + ": " + r.failure());
                assertEquals(n, r.steps(), "steps checked");
                assertEquals("matched", r.digest());
                assertTrue(r.goalUsed());
                String text = Files.readString(m.proof(), StandardCharsets.UTF_8);
                if (!forget) assertFalse(text.contains("\nforget "), "forget lines at " + n);
                else if (n >= min + 40) assertTrue(text.contains("\nforget "), "no forget lines at " + n);
            }
        }
    }

    @ParameterizedTest
    @MethodSource("generated")
    void withoutDigestTheCertificateHasNoDigestLine(String name) throws IOException {
        Family f = Families.family(name);
        Families.Member m = Families.generate(f, f.minSteps() + 20, false, false, dir);
        assertFalse(Files.readString(m.proof()).contains("digest"));
        CheckResult r = check(m);
        assertEquals(Verdict.THEOREM, r.verdict(), String.valueOf(r.failure()));
        assertEquals("absent", r.digest());
    }

    @Test
    void tooFewStepsIsRefused() {
        for (String name : generated()) {
            Family f = Families.family(name);
            IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                    () -> Families.generate(f, f.minSteps() - 1, false, true, dir));
            assertTrue(e.getMessage().contains("at least " + f.minSteps()), e.getMessage());
        }
    }

    /** Replaces the first match of {@code regex} in the first step line at or after the middle that has one. */
    private static String corruptMiddle(String text, String regex, UnaryOperator<String> replace) {
        String[] lines = text.split("\n", -1);
        Pattern p = Pattern.compile(regex);
        for (int i = lines.length / 2; i < lines.length; i++) {
            if (!lines[i].startsWith("step ")) continue;
            Matcher m = p.matcher(lines[i]);
            if (m.find()) {
                lines[i] = lines[i].substring(0, m.start()) + replace.apply(m.group()) + lines[i].substring(m.end());
                return String.join("\n", lines);
            }
        }
        throw new AssertionError("no line matches " + regex);
    }

    private static String bump(String token) {
        Matcher m = Pattern.compile("(\\D+)(\\d+)").matcher(token);
        assertTrue(m.matches(), token);
        return m.group(1) + (Integer.parseInt(m.group(2)) + 1);
    }

    /** One token changed in a step in the second half of each family, or in its last step. */
    static List<Object[]> corruptions() {
        return Arrays.asList(new Object[][] {
                {"chain", ": clause \\[p\\] Badge\\(p, gate[0-3]", (UnaryOperator<String>) s -> s.substring(0, s.length() - 1)
                        + (char) (s.charAt(s.length() - 1) + 1)},
                {"chain", "instantiate s\\d+ \\{p := mira\\}", (UnaryOperator<String>) s -> s.replace("mira", "gate0")},
                {"wide", "factor s\\d+\\.60", (UnaryOperator<String>) s -> s.replace(".60", ".59")},
                {"wide", "Bin\\(bay\\d+, y\\)", (UnaryOperator<String>) s -> s.replace("y)", "x)")},
                {"deep", "open_c\\.1$", (UnaryOperator<String>) s -> s.replace("open_c", "stock_c")},
                {"deep", "vial\\)+ by", (UnaryOperator<String>) s -> s.replaceFirst("vial", "x")},
                {"equality", "@ 2$", (UnaryOperator<String>) s -> "@ 1"},
                {"equality", "eqres s\\d+\\.1", (UnaryOperator<String>) s -> s.replace(".1", ".2")},
                {"equality", "lane\\d_c\\.1 ->", (UnaryOperator<String>) s -> s.replace("->", "<-")},
                {"unify", "grid\\d+_c\\.1", (UnaryOperator<String>) s -> s.replace(".1", ".2")},
                {"unify", "row\\d+_c\\.1, differ_c\\.1", (UnaryOperator<String>) s -> s.replace("differ_c", "goal_c")},
        });
    }

    @ParameterizedTest
    @MethodSource("corruptions")
    void aOneTokenCorruptionIsRejected(String name, String regex, UnaryOperator<String> replace) throws IOException {
        Family f = Families.family(name);
        Families.Member m = Families.generate(f, f.minSteps() + 60, false, true, dir);
        assertEquals(Verdict.THEOREM, check(m).verdict());
        String text = Files.readString(m.proof(), StandardCharsets.UTF_8);
        String bad = corruptMiddle(text, regex, replace);
        assertNotEquals(text, bad);
        Files.writeString(m.proof(), bad, StandardCharsets.UTF_8);
        CheckResult r = check(m);
        assertEquals(Verdict.REJECTED, r.verdict(), "the corrupted certificate of " + name + " was not rejected");
        assertNotNull(r.failure());
    }

    @ParameterizedTest
    @MethodSource("generated")
    void theLastStepIsTheOnlyRefutationAndRestsOnTheGoal(String name) throws IOException {
        Family f = Families.family(name);
        Families.Member m = Families.generate(f, f.minSteps() + 50, false, true, dir);
        CheckResult r = check(m);
        assertEquals("s" + countLabels(m.proof()), r.refutation(), "the refutation is the last numbered step");
        assertTrue(r.axiomsUnused().isEmpty() || !r.axiomsUsed().isEmpty());
    }

    private static long countLabels(Path proof) throws IOException {
        return Files.readAllLines(proof).stream().filter(l -> l.matches("step s\\d+: .*")).count();
    }

    @Test
    void theCorpusIsCopiedWithItsStepCounts() throws IOException {
        Path source = Path.of("certificates", "pelletier");
        List<Families.Member> members = Families.copyCorpus(source, dir);
        assertTrue(members.size() >= 10, "pairs found: " + members.size());
        for (Families.Member m : members) {
            CheckResult r = check(m);
            // Every pair verifies; one of them is vacuous on purpose (its README says which).
            assertTrue(r.verdict() == Verdict.THEOREM || r.verdict() == Verdict.VACUOUS, m + ": " + r.failure());
            assertEquals(m.steps(), r.steps(), m.proof().toString());
        }
    }

    @Test
    void bumpIsAOneTokenChange() {
        assertEquals("gate4", bump("gate3"));
    }
}
