package org.rimeward.crop;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rimeward.io.Yaml.Entry;
import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.io.BadInputException;
import org.rimeward.units.UnitSystem;

/**
 * Text surgery on a crop file that people edit by hand: replace one value, or insert lines after
 * the node they belong to at its indentation, so that every other byte, comments included, stays
 * as it was. The parsed tree ({@link org.rimeward.io.Yaml}) gives the offsets; nothing here re-serialises it.
 */
final class YamlSplice {
  private YamlSplice() {}

  static MapNode varietyNode(MapNode root, String id) {
    for (Node n : ((SeqNode) root.get("varieties")).items()) {
      MapNode m = (MapNode) n;
      if (id.equals(((Scalar) m.get("id")).text().strip())) {
        return m;
      }
    }
    throw new IllegalStateException("variety " + id + " not in the tree");
  }

  static MapNode overrideNode(SeqNode overrides, String stage) {
    for (Node n : overrides.items()) {
      if (n instanceof MapNode m && m.get("stage") instanceof Scalar s && stage.equals(s.text().strip())) {
        return m;
      }
    }
    return null;
  }

  /** Replaces the keys {@code m} has, and adds the others after its last line. */
  static String setKeys(String file, String text, MapNode m, Map<String, String> fields, String nl) {
    if (m.flow()) {
      throw BadInputException.at(file + ":" + m.line(), "this override is written in flow style"
          + " ({...}); write it as a block mapping so it can be edited here");
    }
    StringBuilder added = new StringBuilder();
    String ind = " ".repeat(m.col() - 1);
    List<Scalar> replace = new ArrayList<>();
    List<String> with = new ArrayList<>();
    for (Map.Entry<String, String> e : fields.entrySet()) {
      Node n = m.get(e.getKey());
      if (n instanceof Scalar s && !s.isNull()) {
        replace.add(s);
        with.add(e.getValue());
      } else if (n == null) {
        added.append(ind).append(e.getKey()).append(": ").append(e.getValue()).append(nl);
      } else {
        throw BadInputException.at(file + ":" + n.line(), e.getKey() + ": expected a single value");
      }
    }
    // The added lines go after every scalar of this mapping, so the scalars' offsets still hold;
    // replacing from the last one backwards keeps the earlier offsets valid too.
    StringBuilder out = new StringBuilder(added.length() == 0 ? text
        : insertAfterLineOf(text, m.end(), added.toString(), nl));
    List<Integer> order = new ArrayList<>();
    for (int i = 0; i < replace.size(); i++) {
      order.add(i);
    }
    order.sort((x, y) -> Integer.compare(replace.get(y).start(), replace.get(x).start()));
    for (int i : order) {
      out.replace(replace.get(i).start(), replace.get(i).end(), with.get(i));
    }
    return out.toString();
  }

  static void copyScalar(String text, MapNode from, String key, Map<String, String> fields) {
    if (from.get(key) instanceof Scalar s && !s.isNull()) {
      fields.put(key, raw(text, s));
    }
  }

  static String copiedOverrides(String text, MapNode from, String ind, String nl) {
    if (from == null || !(from.get("overrides") instanceof SeqNode seq) || seq.items().isEmpty()) {
      return "";
    }
    StringBuilder b = new StringBuilder(ind).append("overrides:").append(nl);
    for (Node n : seq.items()) {
      Map<String, String> fields = new LinkedHashMap<>();
      for (Entry e : ((MapNode) n).entries().values()) {
        fields.put(e.key(), raw(text, (Scalar) e.value()));
      }
      b.append(item(fields, ind + "  ", nl));
    }
    return b.toString();
  }

  static String raw(String text, Scalar s) {
    String r = text.substring(s.start(), s.end());
    return r.contains("\n") || r.contains("\r") ? quote(s.text()) : r;
  }

  /** One block-sequence item: the first key after {@code dash + "- "}, the rest aligned under it. */
  static String item(Map<String, String> fields, String dash, String nl) {
    StringBuilder b = new StringBuilder();
    String ind = dash + "  ";
    boolean first = true;
    for (Map.Entry<String, String> e : fields.entrySet()) {
      b.append(first ? dash + "- " : ind).append(e.getKey()).append(": ").append(e.getValue()).append(nl);
      first = false;
    }
    return b.toString();
  }

  static String dashIndent(String file, String text, SeqNode seq) {
    Node first = seq.items().get(0);
    int lineStart = text.lastIndexOf('\n', Math.max(0, first.start() - 1)) + 1;
    int dashCol = first.col() - 3;
    if (dashCol < 0 || text.charAt(lineStart + dashCol) != '-'
        || text.charAt(lineStart + dashCol + 1) != ' ') {
      throw BadInputException.at(file + ":" + first.line(), "this list is not laid out as '- key:"
          + " value' with one space after the dash; lay it out that way so it can be edited here");
    }
    return " ".repeat(dashCol);
  }

  static String insertAfterLineOf(String text, int offset, String lines, String nl) {
    int i = text.indexOf('\n', Math.max(0, offset - 1));
    if (i < 0) {
      return text + nl + lines;
    }
    return text.substring(0, i + 1) + lines + text.substring(i + 1);
  }

  static String replaceFlowWithBlock(String text, SeqNode seq, String block, String nl) {
    int from = seq.start();
    while (from > 0 && text.charAt(from - 1) == ' ') {
      from--;
    }
    int to = text.indexOf('\n', seq.end());
    to = to < 0 ? text.length() : to + 1;
    String rest = text.substring(seq.end(), to).strip();
    if (!rest.isEmpty() && !rest.startsWith("#")) {
      throw new BadInputException("cannot edit the flow list on line " + seq.line()
          + "; write it as a block list");
    }
    return text.substring(0, from) + (rest.isEmpty() ? "" : " " + rest) + nl + block + text.substring(to);
  }

  static String remove(String text, Entry e, String nl) {
    int lineStart = text.lastIndexOf('\n', Math.max(0, e.value().end() - 1)) + 1;
    int lineEnd = text.indexOf('\n', e.value().end());
    return text.substring(0, lineStart) + (lineEnd < 0 ? "" : text.substring(lineEnd + 1));
  }

  static String ensureNewline(String text, String nl) {
    return text.isEmpty() || text.endsWith("\n") ? text : text + nl;
  }

  static String newline(String text) {
    return text.contains("\r\n") ? "\r\n" : "\n";
  }

  /** The quantity as the user wrote it, with the unit of {@code bareAs} added to a bare number. */
  static String withUnit(String text, UnitSystem bareAs) {
    String t = text.strip();
    if (t.matches("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)")) {
      return t + (bareAs == UnitSystem.US ? "F" : "C");
    }
    return t;
  }

  /** A YAML double-quoted scalar. */
  static String quote(String s) {
    StringBuilder b = new StringBuilder("\"");
    for (char c : s.toCharArray()) {
      switch (c) {
        case '"' -> b.append("\\\"");
        case '\\' -> b.append("\\\\");
        case '\n' -> b.append("\\n");
        case '\r' -> b.append("\\r");
        case '\t' -> b.append("\\t");
        default -> {
          if (c < 0x20) {
            b.append(String.format("\\x%02x", (int) c));
          } else {
            b.append(c);
          }
        }
      }
    }
    return b.append('"').toString();
  }
}
