package dev.assay.cli;

import dev.assay.gate.GateCase;
import dev.assay.gate.GateReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "merge", mixinStandardHelpOptions = true,
        description = "Joins the JSON reports of gate shards into one report.",
        footer = {"", "Exit status: 0 when every case is verified, 1 otherwise, 2 for a file error or a case in two reports."})
final class MergeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "REPORT", description = "gate JSON reports (from --json)")
    List<Path> reports;

    @Option(names = "--json", paramLabel = "FILE", required = true, description = "write the merged JSON report")
    Path json;

    @Option(names = "--junit", paramLabel = "FILE", description = "also write merged JUnit XML")
    Path junit;

    @Override
    public Integer call() {
        List<List<GateCase>> shards = new ArrayList<>();
        try {
            for (Path p : reports) shards.add(GateReport.read(p));
            List<GateCase> all = GateReport.merge(shards);
            Files.writeString(json, GateReport.json(all, true), StandardCharsets.UTF_8);
            if (junit != null) Files.writeString(junit, GateReport.junit(all, "assay gate"), StandardCharsets.UTF_8);
            spec.commandLine().getOut().print(GateReport.table(all, true));
            return all.stream().allMatch(GateCase::verified) ? 0 : 1;
        } catch (IOException | IllegalArgumentException e) {
            spec.commandLine().getErr().println("assay merge: " + e.getMessage());
            return 2;
        }
    }
}
