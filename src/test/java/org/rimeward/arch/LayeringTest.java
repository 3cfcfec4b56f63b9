package org.rimeward.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.library.Architectures;
import com.tngtech.archunit.library.Architectures.LayeredArchitecture;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The layering DEVELOPERS.md states, held as a test: dependencies point down the list below and
 * never up or sideways between layers; picocli only in {@code cli}; the rule engine only in
 * {@code rules}. A new package goes into {@link #LAYERS} where it belongs; one left out fails
 * {@link #everyPackageHasALayer()}.
 */
class LayeringTest {
  /**
   * Top to bottom. A layer may use any layer below it, never one above. Packages in one layer
   * (the domain) may use each other. {@code audit} sits above {@code plan}: it records plans and
   * replays them with the planner, and the planner knows nothing of the trail.
   */
  static final List<Layer> LAYERS = List.of(
      new Layer("cli", "org.rimeward.cli.."),
      // The HTML pages and the season: drawn from tonight's plan or from the trail.
      new Layer("report", "org.rimeward.report.."),
      // The night watch: re-plans through plan, records alarms and re-plans through audit.
      new Layer("watch", "org.rimeward.watch.."),
      new Layer("audit", "org.rimeward.audit.."),
      new Layer("plan", "org.rimeward.plan.."),
      // The one package that talks to the network: below plan, above the domain it reads.
      new Layer("fetch", "org.rimeward.fetch.."),
      new Layer("rules", "org.rimeward.rules.."),
      new Layer("domain", "org.rimeward.weather..", "org.rimeward.physics..",
          "org.rimeward.crop..", "org.rimeward.farm..", "org.rimeward.water..",
          "org.rimeward.minimum.."),
      new Layer("units", "org.rimeward.units.."),
      new Layer("io", "org.rimeward.io.."),
      // BuildInfo: the version, read by anything that prints or records it.
      new Layer("base", "org.rimeward"));

  /** KIE classes the rule book needs below the public API: building a knowledge base directly. */
  static final String KIESESSION_USERS = "org.rimeward.rules.RuleBook";

  record Layer(String name, String... packages) {}

  static JavaClasses main;

  @BeforeAll
  static void importMain() {
    main = new ClassFileImporter()
        .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
        .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_JARS)
        .importPackages("org.rimeward");
  }

  @Test
  void dependenciesPointDownTheLayers() {
    LayeredArchitecture arch = Architectures.layeredArchitecture().consideringOnlyDependenciesInLayers();
    for (Layer l : LAYERS) {
      arch = arch.layer(l.name()).definedBy(l.packages());
    }
    for (int i = 0; i < LAYERS.size(); i++) {
      List<String> above = new ArrayList<>();
      LAYERS.subList(0, i).forEach(l -> above.add(l.name()));
      arch = above.isEmpty()
          ? arch.whereLayer(LAYERS.get(i).name()).mayNotBeAccessedByAnyLayer()
          : arch.whereLayer(LAYERS.get(i).name()).mayOnlyBeAccessedByLayers(above.toArray(String[]::new));
    }
    arch.check(main);
  }

  @Test
  void everyPackageHasALayer() {
    String[] all = LAYERS.stream().flatMap(l -> Arrays.stream(l.packages())).toArray(String[]::new);
    classes().should().resideInAnyPackage(all)
        .as("every main class is in a package listed in LayeringTest.LAYERS")
        .check(main);
  }

  @Test
  void picocliOnlyInTheCommandLine() {
    noClasses().that().resideOutsideOfPackage("org.rimeward.cli..")
        .should().dependOnClassesThat().resideInAPackage("picocli..")
        .check(main);
  }

  @Test
  void ruleEngineOnlyInTheRuleBook() {
    noClasses().that().resideOutsideOfPackage("org.rimeward.rules..")
        .should().dependOnClassesThat().resideInAnyPackage("org.kie..", "org.drools..")
        .check(main);
    noClasses().that().resideInAPackage("org.rimeward.rules.facts..")
        .should().dependOnClassesThat().resideInAnyPackage("org.kie..", "org.drools..")
        .as("the rules' vocabulary is plain records, free of the engine")
        .check(main);
    noClasses().that().doNotHaveFullyQualifiedName(KIESESSION_USERS)
        .should().dependOnClassesThat().resideInAPackage("org.drools.kiesession..")
        .as("Drools internals (org.drools.kiesession) only where the rule book builds its base")
        .check(main);
  }
}
