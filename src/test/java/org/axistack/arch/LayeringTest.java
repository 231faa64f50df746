package org.axistack.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/** Physics packages never depend on input/output, the command line, plotting or Swing (architecture.md). */
class LayeringTest {

    private static final JavaClasses CLASSES = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPackages("org.axistack");

    @Test
    void physicsKnowsNothingOfFilesWindowsOrTheCommandLine() {
        noClasses().that().resideInAnyPackage("org.axistack.model..", "org.axistack.mesh..", "org.axistack.field..",
                        "org.axistack.optics..", "org.axistack.trace..", "org.axistack.beam..", "org.axistack.tune..",
                        "org.axistack.size..", "org.axistack.verify..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.io..", "org.axistack.cli..",
                        "org.axistack.report..", "org.axistack.ui..", "java.awt..", "javax.swing..", "org.jfree..",
                        "picocli..", "org.tomlj..", "com.fasterxml..", "org.apache.commons.csv..")
                .allowEmptyShould(true)
                .check(CLASSES);
    }

    @Test
    void thePlanUseCaseKnowsNothingOfTheCommandLineOrWindow() {
        noClasses().that().resideInAPackage("org.axistack.plan..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.cli..", "org.axistack.ui..",
                        "javax.swing..", "picocli..")
                .check(CLASSES);
    }

    @Test
    void inputOutputDoesNotDependOnTheCommandLineOrWindow() {
        noClasses().that().resideInAPackage("org.axistack.io..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.cli..", "org.axistack.ui..",
                        "org.axistack.report..", "javax.swing..")
                .check(CLASSES);
    }
}
