package dev.assay.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ShowAndUnifyTest {

    static List<Path> validProofs() throws IOException {
        try (Stream<Path> s = Files.walk(Path.of("certificates"))) {
            return s.filter(p -> p.toString().endsWith(".proof") && !p.toString().contains("broken")).sorted().toList();
        }
    }

    /** Parse, print, parse again: the second print is the first, and the verdict is the same. */
    @Test
    void showRoundTripsEveryValidExample(@TempDir Path dir) throws IOException {
        for (Path proof : validProofs()) {
            Path problem = Path.of(proof.toString().replace(".proof", ".problem"));
            MainTest.Run first = MainTest.run("show", problem.toString(), proof.toString());
            MainTest.Run check = MainTest.run("check", "-q", problem.toString(), proof.toString());
            assertEquals(check.status(), first.status(), proof + "\n" + first.all());
            String[] parts = first.out().split("\n\n", 2);
            Path p2 = dir.resolve("again.problem");
            Path c2 = dir.resolve("again.proof");
            Files.writeString(p2, parts[0] + "\n", StandardCharsets.UTF_8);
            Files.writeString(c2, parts[1], StandardCharsets.UTF_8);
            MainTest.Run second = MainTest.run("show", p2.toString(), c2.toString());
            assertEquals(first.out(), second.out(), proof.toString());
            assertEquals(first.status(), second.status(), proof + "\n" + second.all());
        }
    }

    @Test
    void unifyPrintsAMostGeneralUnifierOrTheReason() {
        MainTest.Run ok = MainTest.run("unify", "--vars", "x,y,z", "f(x, g(y))", "f(g(z), x)");
        assertEquals(0, ok.status(), ok.all());
        assertTrue(ok.out().contains("{x := g(y), z := y}"), ok.out());
        MainTest.Run occurs = MainTest.run("unify", "--vars", "x,y", "Link(x, x)", "Link(y, next(y))");
        assertEquals(1, occurs.status(), occurs.all());
        assertTrue(occurs.out().contains("y occurs in next(y)"), occurs.out());
        MainTest.Run clash = MainTest.run("unify", "f(a)", "f(b)");
        assertEquals(1, clash.status());
        assertTrue(clash.out().contains("a and b clash"), clash.out());
        MainTest.Run bad = MainTest.run("unify", "f(a", "b");
        assertEquals(2, bad.status());
        MainTest.noStackTrace(bad);
    }
}
