package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

/**
 * Every command's {@code --help} is pinned word for word in {@code src/test/resources/help/}, renders
 * without picocli warnings and carries the cautions a grower must see. After changing a command
 * or adding one, regenerate the pinned texts and read the diff:
 * {@code mvn test -Dtest=HelpTest -Drimeward.help.update=true}.
 */
class HelpTest {
  static final Path PINNED = Path.of("src/test/resources/help");
  static final boolean UPDATE = Boolean.getBoolean("rimeward.help.update");

  static Stream<String> commands() {
    List<String> out = new ArrayList<>();
    collect(new CommandLine(new RimewardCommand()), "", out);
    return out.stream();
  }

  private static void collect(CommandLine c, String prefix, List<String> out) {
    out.add(prefix.strip());
    c.getSubcommands().forEach((name, sub) -> {
      if (!name.equals("help") && sub.getCommandName().equals(name)) {
        collect(sub, prefix + " " + name, out);
      }
    });
  }

  /** {@code rimeward.txt}, {@code plan.txt}, {@code audit-why.txt}, ... */
  static Path pinned(String command) {
    return PINNED.resolve((command.isEmpty() ? "rimeward" : command.replace(' ', '-')) + ".txt");
  }

  @ParameterizedTest(name = "rimeward {0} --help")
  @MethodSource("commands")
  void helpIsPinnedRendersWithoutWarningsAndShowsTheCautions(String command) throws IOException {
    PrintStream saved = System.err;
    ByteArrayOutputStream stray = new ByteArrayOutputStream();
    Cli.Result r;
    try {
      System.setErr(new PrintStream(stray, true, StandardCharsets.UTF_8));
      List<String> args = new ArrayList<>(command.isEmpty() ? List.of() : List.of(command.split(" ")));
      args.add("--help");
      r = Cli.run(args.toArray(String[]::new));
    } finally {
      System.setErr(saved);
    }
    assertThat(r.exitCode()).isZero();
    assertThat(stray.toString(StandardCharsets.UTF_8)).as("picocli warnings").isEmpty();
    assertThat(r.out()).contains("Usage: rimeward");
    if (command.split(" ").length <= 1) {
      assertThat(r.out()).as("cautions in the help of '%s'", command).contains("Decision support only");
    }
    String text = r.out().replace("\r\n", "\n");
    Path file = pinned(command);
    if (UPDATE) {
      Files.createDirectories(PINNED);
      Files.writeString(file, text, StandardCharsets.UTF_8);
    }
    assertThat(file).as("pinned help of 'rimeward %s'; write it with -Drimeward.help.update=true",
        command).exists();
    assertThat(text).as("help of 'rimeward %s' differs from %s; if the change is meant,"
        + " regenerate with -Drimeward.help.update=true and read the diff", command, file)
        .isEqualTo(Files.readString(file, StandardCharsets.UTF_8));
  }

  @Test
  void noPinnedHelpForACommandThatIsGone() throws IOException {
    Set<String> expected = commands().map(c -> pinned(c).getFileName().toString())
        .collect(Collectors.toCollection(TreeSet::new));
    Set<String> present;
    try (Stream<Path> files = Files.list(PINNED)) {
      present = files.map(p -> p.getFileName().toString()).collect(Collectors.toCollection(TreeSet::new));
    }
    if (UPDATE) {
      for (String stale : present) {
        if (!expected.contains(stale)) {
          Files.delete(PINNED.resolve(stale));
        }
      }
      return;
    }
    assertThat(present).as("pinned help texts in %s", PINNED).isEqualTo(expected);
  }
}
