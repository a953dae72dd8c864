package dev.assay.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The generated families by name, and the writing of a member to a folder. */
public final class Families {

    /** The family that is not generated: the reference prover's certificates, timed as they are. */
    public static final String CORPUS = "corpus";

    private static final Map<String, Family> FAMILIES = new LinkedHashMap<>();

    static {
        for (Family f : List.of(new ChainFamily(), new WideFamily(), new DeepFamily(), new EqualityFamily(),
                new UnifyFamily())) {
            FAMILIES.put(f.name(), f);
        }
    }

    private Families() {
    }

    /** Every family name, the generated ones first, then {@value #CORPUS}. */
    public static List<String> names() {
        List<String> names = new ArrayList<>(FAMILIES.keySet());
        names.add(CORPUS);
        return names;
    }

    /** The generated family of this name, or null. */
    public static Family family(String name) {
        return FAMILIES.get(name);
    }

    /** A problem and certificate written to disk, with the certificate's size. */
    public record Member(String family, long steps, Path problem, Path proof, long bytes) {
    }

    /**
     * Writes {@code DIR/FAMILY-STEPS.problem} and {@code .proof}. The certificate carries the problem's digest unless
     * {@code digest} is false, and {@code forget} lines when {@code forget} is true.
     */
    public static Member generate(Family family, long steps, boolean forget, boolean digest, Path dir)
            throws IOException {
        if (steps < family.minSteps()) {
            throw new IllegalArgumentException("family " + family.name() + " needs at least " + family.minSteps()
                    + " steps, not " + steps);
        }
        Files.createDirectories(dir);
        String base = family.name() + "-" + steps;
        Path problem = dir.resolve(base + ".problem");
        Path proof = dir.resolve(base + ".proof");
        byte[] text = family.problem(steps).getBytes(StandardCharsets.UTF_8);
        Files.write(problem, text);
        try (OutputStream out = Files.newOutputStream(proof); ProofWriter w = new ProofWriter(out, forget)) {
            family.proof(steps, digest ? sha256(text) : null, w);
            w.close();
            if (w.steps() != steps) {
                throw new IllegalStateException("family " + family.name() + " wrote " + w.steps() + " steps, not " + steps);
            }
        }
        return new Member(family.name(), steps, problem, proof, Files.size(proof) + text.length);
    }

    /** Copies every {@code .problem} with its {@code .proof} from {@code source} to {@code dir}, in name order. */
    public static List<Member> copyCorpus(Path source, Path dir) throws IOException {
        List<Path> problems = new ArrayList<>();
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(source, "*.problem")) {
            for (Path p : ds) problems.add(p);
        }
        problems.sort(null);
        Files.createDirectories(dir);
        List<Member> out = new ArrayList<>();
        for (Path p : problems) {
            String base = p.getFileName().toString().replaceFirst("\\.problem$", "");
            Path proof = source.resolve(base + ".proof");
            if (!Files.isRegularFile(proof)) continue;
            Path tp = dir.resolve(base + ".problem");
            Path tc = dir.resolve(base + ".proof");
            if (!tp.equals(p)) {
                Files.copy(p, tp, StandardCopyOption.REPLACE_EXISTING);
                Files.copy(proof, tc, StandardCopyOption.REPLACE_EXISTING);
            }
            long steps = 0;
            for (String line : Files.readAllLines(tc, StandardCharsets.UTF_8)) if (line.startsWith("step ")) steps++;
            out.add(new Member(CORPUS, steps, tp, tc, Files.size(tp) + Files.size(tc)));
        }
        return out;
    }

    static String sha256(byte[] bytes) {
        return dev.assay.check.Checker.sha256(bytes);
    }
}
