package dev.assay;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.constructors;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import dev.assay.kernel.Fact;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The boundaries of STYLE.md: the trusted kernel imports nothing but {@code java.*}; nothing trusted depends on the
 * untrusted prover; the kernel knows nothing of syntax, checking, reports or the command line; and only the kernel can
 * make a checked fact.
 */
class ArchitectureTest {

    private static JavaClasses production;

    @BeforeAll
    static void importClasses() {
        production = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                // The build folder can be moved (-Dassay.build.dir), so also leave out any test-classes folder.
                .withImportOption(location -> !location.contains("/test-classes/"))
                .importPackages("dev.assay");
    }

    @Test
    void kernelDependsOnlyOnJavaAndItself() {
        ArchRule rule = classes().that().resideInAPackage("dev.assay.kernel..")
                .should().onlyDependOnClassesThat().resideInAnyPackage("java..", "dev.assay.kernel..")
                .because("the trusted kernel must be readable on its own (STYLE.md)");
        rule.check(production);
    }

    @Test
    void nothingTrustedDependsOnTheProver() {
        ArchRule rule = noClasses().that().resideInAnyPackage("dev.assay.kernel..", "dev.assay.syntax..", "dev.assay.check..")
                .should().dependOnClassesThat().resideInAPackage("dev.assay.prover..")
                .because("the reference prover is untrusted; nothing trusted imports it (STYLE.md)")
                .allowEmptyShould(true);
        rule.check(production);
    }

    @Test
    void checkingDoesNotDependOnReportsGateOrCommandLine() {
        ArchRule rule = noClasses().that().resideInAnyPackage("dev.assay.syntax..", "dev.assay.check..")
                .should().dependOnClassesThat()
                .resideInAnyPackage("dev.assay.report..", "dev.assay.gate..", "dev.assay.cli..", "dev.assay.prover..")
                .allowEmptyShould(true);
        rule.check(production);
    }

    @Test
    void kernelKnowsNothingOfTheLayersAboveIt() {
        ArchRule rule = noClasses().that().resideInAPackage("dev.assay.kernel..")
                .should().dependOnClassesThat()
                .resideInAnyPackage("dev.assay.syntax..", "dev.assay.check..", "dev.assay.report..", "dev.assay.cli..",
                        "dev.assay.gate..", "dev.assay.prover..")
                .allowEmptyShould(true);
        rule.check(production);
    }

    @Test
    void onlyTheKernelMakesFacts() {
        ArchRule constructorsArePrivateToTheKernel = constructors().that().areDeclaredIn(Fact.class)
                .should().notBePublic().andShould().notBeProtected()
                .because("a checked fact is made only by the kernel's rules (STYLE.md)");
        constructorsArePrivateToTheKernel.check(production);
        ArchRule nobodyElseCalls = noClasses().that().resideOutsideOfPackage("dev.assay.kernel..")
                .should().callConstructor(Fact.class, dev.assay.kernel.Kernel.class, String.class,
                        dev.assay.kernel.Formula.class, dev.assay.kernel.Clause.class)
                .allowEmptyShould(true);
        nobodyElseCalls.check(production);
    }
}
