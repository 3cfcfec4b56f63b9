package org.rimeward.cli;

import org.rimeward.units.UnitSystem;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/**
 * {@code --units}, declared once and mixed into the commands that print quantities or read bare
 * temperatures, and only those. Given before the command ({@code rimeward --units us plan}) it
 * applies to whichever command follows.
 */
final class UnitsOption {
  @Option(names = "--units", paramLabel = "metric|us", converter = UnitsOption.Converter.class,
      description = "Units shown in output and for bare temperatures on the command line "
          + "(default: metric). JSON is always metric.")
  UnitSystem units;

  /** This command's units: given here, else given before the command, else metric. */
  UnitSystem system() {
    return units != null ? units : UnitSystem.METRIC;
  }

  /** The units for the command {@code spec} stands for. */
  static UnitSystem of(CommandSpec spec) {
    UnitSystem own = find(spec);
    if (own != null) {
      return own;
    }
    UnitSystem root = find(spec.root());
    return root != null ? root : UnitSystem.METRIC;
  }

  private static UnitSystem find(CommandSpec spec) {
    for (CommandSpec m : spec.mixins().values()) {
      if (m.userObject() instanceof UnitsOption u && u.units != null) {
        return u.units;
      }
    }
    return null;
  }

  static final class Converter implements ITypeConverter<UnitSystem> {
    @Override
    public UnitSystem convert(String value) {
      return UnitSystem.parse(value);
    }
  }
}
