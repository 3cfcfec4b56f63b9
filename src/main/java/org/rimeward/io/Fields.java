package org.rimeward.io;

import java.util.List;
import org.rimeward.io.Yaml.Entry;
import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;

/**
 * One mapping of a YAML input read field by field. A field that is missing, empty, of the wrong
 * shape or unreadable adds one problem (line, field path, value, what to write) to the file's
 * {@link Problems} and reads as null, so the reader goes on and every problem is reported at once.
 * Readers of every YAML input use this; a new input format writes a reader of the same shape.
 */
public final class Fields {
  /** Reads a field's text into a value; throws {@link IllegalArgumentException} saying why not. */
  @FunctionalInterface
  public interface Parser<T> {
    T parse(String text);
  }

  private final MapNode node;
  private final String path;
  private final int line;
  private final Problems problems;

  private Fields(MapNode node, String path, int line, Problems problems) {
    this.node = node;
    this.path = path;
    this.line = line;
    this.problems = problems;
  }

  /**
   * The mapping {@code n}, named {@code path} in messages; null (and a problem) when {@code n} is
   * a list or a value. {@code expected} lists what the mapping holds.
   */
  public static Fields of(Node n, String path, String expected, Problems problems) {
    if (n instanceof MapNode m) {
      return new Fields(m, path, m.line(), problems);
    }
    problems.add(n.line(), prefix(path) + "expected a section with " + expected
        + " (key: value lines), found " + describe(n));
    return null;
  }

  /**
   * This item of the list {@code listField}, named by its {@code id} from now on (so later
   * problems say {@code stages[tight-cluster].t10}), with an id an earlier item already used
   * reported as a problem on {@code id}: {@code repeated} words it from the line of the first
   * use. {@code seen} maps the ids read so far to their lines.
   */
  public Fields namedById(String id, String listField, java.util.Map<String, Integer> seen,
      java.util.function.IntFunction<String> repeated) {
    Fields named = renamed(listField + "[" + id + "]");
    Integer first = seen.putIfAbsent(id, named.lineOf("id"));
    if (first != null) {
      named.problem("id", repeated.apply(first));
    }
    return named;
  }

  /** The same mapping under another name in messages (once its id is known). */
  public Fields renamed(String newPath) {
    return new Fields(node, newPath, line, problems);
  }

  public MapNode node() {
    return node;
  }

  public Problems problems() {
    return problems;
  }

  /** The line of the key that opened this mapping, or of its first key. */
  public int line() {
    return line;
  }

  /** Adds a problem for every key not in {@code keys}. */
  public void allow(String... keys) {
    List<String> allowed = List.of(keys);
    for (Entry e : node.entries().values()) {
      if (!allowed.contains(e.key())) {
        problems.add(e.keyLine(), field(e.key()) + ": unknown key; allowed here: "
            + String.join(", ", allowed) + " (check the spelling)");
      }
    }
  }

  public boolean has(String key) {
    return node.entries().containsKey(key);
  }

  public Entry entry(String key) {
    return node.entries().get(key);
  }

  /** Where {@code key} was written, or this mapping's line when it was not. */
  public int lineOf(String key) {
    Entry e = entry(key);
    return e == null ? line : e.keyLine();
  }

  /** The dotted name of {@code key} in messages, e.g. {@code blocks[north].area}. */
  public String field(String key) {
    return path.isEmpty() ? key : path + "." + key;
  }

  /** A problem with {@code key}'s value, at its line. */
  public void problem(String key, String message) {
    problems.add(lineOf(key), field(key) + ": " + message);
  }

  /** A problem with the mapping as a whole. */
  public void problem(String message) {
    problems.add(line, prefix(path) + message);
  }

  /** The value of {@code key} as written, quoted for a message. */
  public String quoted(String key) {
    Entry e = entry(key);
    return e != null && e.value() instanceof Scalar s && !s.isNull() ? Text.quote(s.text())
        : "the value";
  }

  /** The text of a required field; null and a problem when it is missing or empty. */
  public String text(String key, String hint) {
    if (!has(key)) {
      problems.add(line, prefix(path) + "'" + key + "' is required; " + hint);
      return null;
    }
    return optionalText(key);
  }

  /** The text of an optional field, or null when absent; a problem when present but empty. */
  public String optionalText(String key) {
    Entry e = entry(key);
    if (e == null) {
      return null;
    }
    if (e.value() instanceof Scalar s) {
      String v = s.value();
      if (v == null) {
        problem(key, "expected a value, found nothing; write it after the colon or leave the line"
            + " out");
      }
      return v;
    }
    problem(key, "expected a single value, found " + describe(e.value()));
    return null;
  }

  /** The required field read by {@code parser}; null and a problem when it cannot be. */
  public <T> T value(String key, Parser<T> parser, String hint) {
    return parse(key, text(key, hint), parser);
  }

  /** The optional field read by {@code parser}, or null when absent or unreadable. */
  public <T> T optionalValue(String key, Parser<T> parser) {
    return parse(key, optionalText(key), parser);
  }

  private <T> T parse(String key, String text, Parser<T> parser) {
    if (text == null) {
      return null;
    }
    try {
      return parser.parse(text);
    } catch (IllegalArgumentException e) {
      String m = e.getMessage();
      // Quantity and number messages may already start with the field's name.
      problems.add(lineOf(key), m.startsWith(field(key) + ":") ? m : field(key) + ": " + m);
      return null;
    }
  }

  /** The nested mapping under {@code key}, or null (and a problem) when it is not one. */
  public Fields map(String key, String expected) {
    Entry e = entry(key);
    if (e == null) {
      return null;
    }
    Fields f = of(e.value(), field(key), expected, problems);
    return f == null ? null : new Fields(f.node, f.path, e.keyLine(), problems);
  }

  /** The list under {@code key}, or null (and a problem) when it is not one. */
  public SeqNode list(String key) {
    Entry e = entry(key);
    if (e == null) {
      return null;
    }
    if (e.value() instanceof SeqNode s) {
      return s;
    }
    problem(key, "expected a list ('- ' items), found " + describe(e.value()));
    return null;
  }

  private static String prefix(String path) {
    return path.isEmpty() ? "" : path + ": ";
  }

  /** A node as a message describes it. */
  public static String describe(Node n) {
    if (n instanceof SeqNode) {
      return "a list";
    }
    if (n instanceof MapNode) {
      return "a section of keys";
    }
    Scalar s = (Scalar) n;
    return s.value() == null ? "nothing" : Text.quote(s.text());
  }
}
