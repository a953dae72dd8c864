package dev.assay.cli;

import dev.assay.kernel.Application;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Unification;
import dev.assay.syntax.InputError;
import dev.assay.syntax.ProblemReader;
import dev.assay.syntax.Resolver;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "unify", mixinStandardHelpOptions = true,
        description = {"Prints a most general unifier of two terms (with the occurs check), or why none exists.",
                "Identifiers named by --vars are variables; every other identifier is a symbol.",
                "Example: assay unify --vars x,y 'Link(x, x)' 'Link(y, next(y))'"},
        footer = {"", "Exit status: 0 unifiable, 1 not unifiable, 2 the terms do not parse."})
final class UnifyCommand implements Callable<Integer> {

    /** The two terms are read as arguments of this predicate; its name cannot be written in the language. */
    private static final String HOLDER = "Unify_terms_";

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "TERM", description = "the first term or atom")
    String left;

    @Parameters(index = "1", paramLabel = "TERM", description = "the second term or atom")
    String right;

    @Option(names = "--vars", split = ",", paramLabel = "NAME", description = "the variables, e.g. --vars x,y")
    List<String> vars = List.of();

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        TermFactory terms = new TermFactory();
        String binder = vars.isEmpty() ? "" : "forall " + String.join(" ", vars) + ". ";
        // Atoms are accepted too: as arguments of the holder predicate they are read as terms, which unify the same way.
        String text = "problem unify\naxiom terms: " + binder + HOLDER + "(" + left + ", " + right + ")\n";
        Problem p;
        try {
            p = new Resolver(terms).problem(ProblemReader.readAll("(terms)", text));
        } catch (InputError e) {
            spec.commandLine().getErr().println("assay unify: the terms do not parse: " + e.reason().replace(HOLDER, "the terms"));
            return 2;
        }
        Formula f = p.axioms().get("terms");
        while (f instanceof Formula.Quantified q) f = q.body();
        Application holder = ((Formula.Atomic) f).literal().atom();
        Term a = holder.argument(0);
        Term b = holder.argument(1);
        Unification.Result r = Unification.mostGeneralUnifier(terms, a, b);
        if (r instanceof Unification.Unified u) {
            Substitution s = u.unifier();
            out.println("unifiable");
            out.println("most general unifier: " + Printer.substitution(s, Printer.UNLIMITED));
            out.println("unified term:         " + Printer.term(s.apply(a), 2000));
            return 0;
        }
        out.println("not unifiable: " + ((Unification.NotUnifiable) r).describe());
        return 1;
    }
}
