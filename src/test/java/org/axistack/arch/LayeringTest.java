package org.axistack.arch;

import static com.tngtech.archunit.base.DescribedPredicate.not;
import static com.tngtech.archunit.core.domain.JavaClass.Predicates.belongToAnyOf;
import static com.tngtech.archunit.core.domain.JavaClass.Predicates.resideInAPackage;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.axistack.ui.Desktop;
import org.axistack.ui.LensWindow;
import org.axistack.ui.RecentFiles;
import org.axistack.ui.RedrawBench;
import org.junit.jupiter.api.Test;

/**
 * The layers of architecture.md: physics packages never depend on input/output, the plan, the command line,
 * plotting or Swing; the plan use case (what a plan computes, LensPlan) knows nothing of files, the report, the
 * command line or the window; the report (charts, HTML, the plan folder) renders the plan and knows nothing of
 * the window or the command line; the window knows nothing of the command
 * line; nothing but the command line depends on it; and from outside the window only its entry points are used.
 */
class LayeringTest {

    private static final JavaClasses CLASSES = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPackages("org.axistack");

    @Test
    void physicsKnowsNothingOfFilesWindowsOrTheCommandLine() {
        noClasses().that().resideInAnyPackage("org.axistack.model..", "org.axistack.mesh..", "org.axistack.field..",
                        "org.axistack.optics..", "org.axistack.trace..", "org.axistack.beam..", "org.axistack.tune..",
                        "org.axistack.size..", "org.axistack.verify..", "org.axistack.probe..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.io..", "org.axistack.cli..",
                        "org.axistack.report..", "org.axistack.ui..", "org.axistack.plan..", "java.awt..", "javax.swing..", "org.jfree..",
                        "picocli..", "org.tomlj..", "com.fasterxml..", "org.apache.commons.csv..")
                .allowEmptyShould(true)
                .check(CLASSES);
    }

    @Test
    void thePlanUseCaseKnowsNothingOfFilesTheReportTheCommandLineOrWindow() {
        noClasses().that().resideInAPackage("org.axistack.plan..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.io..", "org.axistack.report..",
                        "org.axistack.cli..", "org.axistack.ui..", "java.awt..", "javax.swing..", "org.jfree..",
                        "picocli..", "org.tomlj..", "com.fasterxml..", "org.apache.commons.csv..")
                .check(CLASSES);
    }

    @Test
    void inputOutputDoesNotDependOnTheCommandLineOrWindow() {
        noClasses().that().resideInAPackage("org.axistack.io..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.cli..", "org.axistack.ui..",
                        "org.axistack.report..", "javax.swing..")
                .check(CLASSES);
    }

    @Test
    void theReportKnowsNothingOfTheWindowOrTheCommandLine() {
        noClasses().that().resideInAPackage("org.axistack.report..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.cli..",
                        "org.axistack.ui..", "javax.swing..", "picocli..")
                .check(CLASSES);
    }

    @Test
    void theWindowKnowsNothingOfTheCommandLine() {
        noClasses().that().resideInAPackage("org.axistack.ui..")
                .should().dependOnClassesThat().resideInAnyPackage("org.axistack.cli..", "picocli..")
                .check(CLASSES);
    }

    @Test
    void nothingButTheCommandLineDependsOnIt() {
        noClasses().that().resideOutsideOfPackage("org.axistack.cli..")
                .should().dependOnClassesThat().resideInAPackage("org.axistack.cli..")
                .check(CLASSES);
    }

    @Test
    void theWindowKeepsItsInsidesToItself() {
        // the command line starts the window (Desktop, which hands back the LensWindow it opened), names its
        // recent files (RecentFiles) and times it (RedrawBench); every other type of the window is its own business
        noClasses().that().resideOutsideOfPackage("org.axistack.ui..")
                .should().dependOnClassesThat(resideInAPackage("org.axistack.ui..")
                        .and(not(belongToAnyOf(Desktop.class, LensWindow.class, RecentFiles.class, RedrawBench.class))))
                .check(CLASSES);
    }
}
