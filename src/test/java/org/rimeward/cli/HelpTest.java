package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

/** Every command's help renders cleanly and carries the cautions a grower must see. */
class HelpTest {
  static Stream<String> commands() {
    List<String> out = new ArrayList<>();
    collect(new CommandLine(new RimewardCommand()), "", out);
    return out.stream();
  }

  private static void collect(CommandLine c, String prefix, List<String> out) {
    out.add(prefix.strip());
    c.getSubcommands().forEach((name, sub) -> {
      if (!name.equals("help")) {
        collect(sub, prefix + " " + name, out);
      }
    });
  }

  @ParameterizedTest(name = "rimeward {0} --help")
  @MethodSource("commands")
  void helpRendersWithoutWarningsAndShowsTheCautions(String command) {
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
  }
}
