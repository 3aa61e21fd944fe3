package halfrail;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

/** The package layers of the design brief: dependencies point downward only. */
class LayerRulesTest {
    private static JavaClasses classes;

    @BeforeAll
    static void importClasses() {
        classes = new ClassFileImporter()
                .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("halfrail");
    }

    @Test
    void nothingBelowTheUserInterfaceUsesJavaFx() {
        ArchRule rule = noClasses().that().resideOutsideOfPackages("halfrail.ui..")
                .and().doNotHaveFullyQualifiedName("halfrail.Main")
                .should().dependOnClassesThat().resideInAnyPackage("javafx..", "org.controlsfx..")
                .allowEmptyShould(true);
        rule.check(classes);
    }

    @Test
    void onlyTheCommandLinePrints() {
        ArchRule rule = noClasses().that().resideOutsideOfPackages("halfrail.cli..", "halfrail.ui..")
                .and().doNotHaveFullyQualifiedName("halfrail.Main")
                .should().accessField(System.class, "out")
                .orShould().accessField(System.class, "err")
                .orShould().callMethod(Throwable.class, "printStackTrace")
                .allowEmptyShould(true);
        rule.check(classes);
    }

    @Test
    void theEngineDoesNotReachUpwards() {
        noClasses().that().resideInAnyPackage("halfrail.units..", "halfrail.circuit..", "halfrail.solve..")
                .should().dependOnClassesThat().resideInAnyPackage("halfrail.parts..", "halfrail.design..",
                        "halfrail.check..", "halfrail.convert..", "halfrail.io..", "halfrail.cli..", "halfrail.ui..")
                .allowEmptyShould(true)
                .check(classes);
        noClasses().that().resideInAnyPackage("halfrail.parts..", "halfrail.design..")
                .should().dependOnClassesThat().resideInAnyPackage("halfrail.check..", "halfrail.convert..",
                        "halfrail.io..", "halfrail.cli..", "halfrail.ui..")
                .allowEmptyShould(true)
                .check(classes);
        noClasses().that().resideInAnyPackage("halfrail.check..", "halfrail.convert..", "halfrail.io..")
                .should().dependOnClassesThat().resideInAnyPackage("halfrail.cli..", "halfrail.ui..")
                .allowEmptyShould(true)
                .check(classes);
    }

    @Test
    void theCircuitModelDoesNotDependOnTheSolver() {
        noClasses().that().resideInAnyPackage("halfrail.circuit..", "halfrail.units..")
                .should().dependOnClassesThat().resideInAnyPackage("halfrail.solve..")
                .allowEmptyShould(true)
                .check(classes);
    }
}
