package org.rimeward.crop;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.rimeward.io.Yaml.Entry;
import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.io.AtomicFiles;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/**
 * Writes varieties and stage overrides into crop files. People edit these files by hand and keep
 * comments in them, so an edit changes the text in place: the one value it sets is replaced, or
 * the lines it adds are inserted after the variety they belong to, at that variety's indentation;
 * every other byte stays as it was. The changed text is read back and checked in full before it
 * replaces the file, atomically, so a rejected or interrupted edit leaves the old file.
 */
public final class ProfileEditor {
  /** Replaces a file's content; the default writes a temporary file and renames it. */
  @FunctionalInterface
  public interface TextWriter {
    void write(Path target, String content) throws IOException;
  }

  private final Path dir;
  private final Clock clock;
  private final TextWriter writer;

  public ProfileEditor(Path dir, Clock clock) {
    this(dir, clock, AtomicFiles::writeString);
  }

  public ProfileEditor(Path dir, Clock clock, TextWriter writer) {
    this.dir = Objects.requireNonNull(dir, "dir");
    this.clock = Objects.requireNonNull(clock, "clock");
    this.writer = Objects.requireNonNull(writer, "writer");
  }

  /**
   * Adds variety {@code variety} to {@code crop}'s file.
   *
   * @param name the display name, or null to use the id
   * @param fromVariety a variety of the same crop whose offset and overrides are copied, or null
   * @param offsetText a hardiness offset with its unit ({@code 0.5C}, {@code 1F}); a bare number
   *     is read in {@code bareAs} units; null for none (or the copied one)
   * @return the edit, field {@code variety}, {@code afterC} the new variety's offset in °C or null
   */
  public ProfileEdit newVariety(String crop, String variety, String name, String fromVariety,
      String offsetText, UnitSystem bareAs, String note, String by) {
    requireNote(note, by);
    Loaded f = load(crop);
    if (!CropFileReader.ID.matcher(variety).matches()) {
      throw new BadInputException("variety '" + variety + "' is not a kebab-case id; use lower case"
          + " letters, digits and single hyphens, e.g. honeycrisp or gala-early");
    }
    f.crop.variety(variety).ifPresent(v -> {
      throw BadInputException.at(f.file + ":" + v.line(), "variety '" + variety + "' already"
          + " exists; change its values with rimeward profile set");
    });
    String nl = newline(f.text);
    Map<String, String> fields = new LinkedHashMap<>();
    fields.put("id", variety);
    fields.put("name", quote(name == null || name.isBlank() ? variety : name.strip()));
    MapNode from = null;
    if (fromVariety != null) {
      f.crop.variety(fromVariety).orElseThrow(() -> unknownVariety(f.crop, fromVariety));
      from = varietyNode(f.root, fromVariety);
      copyScalar(f.text, from, "hardiness_offset", fields);
      Node ex = from.get("offset_except");
      if (ex instanceof SeqNode es) {
        fields.put("offset_except", es.items().stream().map(n -> ((Scalar) n).text())
            .collect(Collectors.joining(", ", "[", "]")));
      }
    }
    if (offsetText != null) {
      Quantities.parse(offsetText, Dimension.TEMPERATURE_DELTA, "--offset", bareAs);
      fields.put("hardiness_offset", withUnit(offsetText, bareAs));
    }
    fields.put("note", quote(fromVariety == null ? note.strip()
        : note.strip() + " (values copied from variety " + fromVariety + ")"));
    fields.put("set_by", quote(by.strip()));
    fields.put("set_on", quote(today()));

    Node vs = f.root.get("varieties");
    String edited;
    if (vs == null || vs instanceof Scalar sc && sc.isNull()) {
      String base = vs == null ? f.text : remove(f.text, f.root.entries().get("varieties"), nl);
      String block = item(fields, "  ", nl) + copiedOverrides(f.text, from, "    ", nl);
      edited = ensureNewline(base, nl) + nl + "varieties:" + nl + block;
    } else if (vs instanceof SeqNode seq && !seq.flow()) {
      String dash = dashIndent(f, seq);
      String block = item(fields, dash, nl) + copiedOverrides(f.text, from, dash + "  ", nl);
      edited = insertAfterLineOf(f.text, seq.end(), block, nl);
    } else if (vs instanceof SeqNode seq && seq.items().isEmpty()) {
      String dash = "  ";
      String block = item(fields, dash, nl) + copiedOverrides(f.text, from, dash + "  ", nl);
      edited = replaceFlowWithBlock(f.text, seq, block, nl);
    } else {
      throw BadInputException.at(f.file + ":" + vs.line(), "varieties are written in flow style"
          + " ([...]); write them as a block list ('- id: ...') so they can be edited here");
    }
    Crop after = check(f, edited);
    Variety v = after.variety(variety).orElseThrow(() -> new IllegalStateException(
        "the new variety was not found after the edit; nothing written"));
    write(f, edited);
    Double offset = v.hardinessOffsetC() == 0 ? null : v.hardinessOffsetC();
    return new ProfileEdit(clock.instant(), by.strip(), f.file, crop, variety, null, "variety",
        null, offset, note.strip());
  }

  /**
   * Sets the T10 and/or T90 of one stage of a variety, writing or updating that variety's override
   * for the stage together with its note, who set it and when.
   *
   * @param t10Text the new T10 with its unit, or bare in {@code bareAs} units; null to keep it
   * @param t90Text the new T90 likewise; null to keep it
   * @return one edit per value set, before and after as the engine sees them (°C)
   */
  public List<ProfileEdit> set(String crop, String variety, String stage, String t10Text,
      String t90Text, UnitSystem bareAs, String note, String by) {
    requireNote(note, by);
    if (t10Text == null && t90Text == null) {
      throw new BadInputException("nothing to set: give --t10 and/or --t90");
    }
    Loaded f = load(crop);
    if (variety == null) {
      throw new BadInputException("profile set changes a variety, not the published base table of '"
          + crop + "'; add a variety with rimeward profile new-variety " + crop + "/NAME --note ...,"
          + " then set its values");
    }
    Variety v = f.crop.variety(variety).orElseThrow(() -> unknownVariety(f.crop, variety));
    f.crop.stage(stage).orElseThrow(() -> new BadInputException("unknown stage '" + stage
        + "' of crop '" + crop + "'; known stages: " + f.crop.stages().stream().map(Stage::id)
        .collect(Collectors.joining(", "))));
    EffectiveStage before = Inheritance.resolve(f.crop, v, (l, m) -> { }).stage(stage).orElseThrow();
    Double t10 = t10Text == null ? null : Quantities.parse(t10Text, Dimension.TEMPERATURE, "--t10", bareAs);
    Double t90 = t90Text == null ? null : Quantities.parse(t90Text, Dimension.TEMPERATURE, "--t90", bareAs);

    String nl = newline(f.text);
    Map<String, String> fields = new LinkedHashMap<>();
    if (t10Text != null) {
      fields.put("t10", withUnit(t10Text, bareAs));
    }
    if (t90Text != null) {
      fields.put("t90", withUnit(t90Text, bareAs));
    }
    fields.put("note", quote(note.strip()));
    fields.put("set_by", quote(by.strip()));
    fields.put("set_on", quote(today()));

    MapNode vnode = varietyNode(f.root, variety);
    Node ov = vnode.get("overrides");
    String edited;
    MapNode existing = ov instanceof SeqNode s ? overrideNode(s, stage) : null;
    if (existing != null) {
      if (existing.get("tolerance") != null) {
        throw BadInputException.at(f.file + ":" + existing.line(), "the " + variety + " override of '"
            + stage + "' gives a single tolerance; change the tolerance in the file by hand");
      }
      // A new note must not wipe the earlier observation behind the override; keep it after the
      // new one, with who set it and when.
      if (existing.get("note") instanceof Scalar old && !old.isNull() && !old.text().isBlank()) {
        String who = existing.get("set_by") instanceof Scalar b && !b.isNull() ? b.text() : null;
        String when = existing.get("set_on") instanceof Scalar d && !d.isNull() ? d.text() : null;
        String earlier = who == null && when == null ? "" : " (" + (who == null ? "" : who)
            + (who != null && when != null ? ", " : "") + (when == null ? "" : when) + ")";
        fields.put("note", quote(note.strip() + "; earlier" + earlier + ": " + old.text().strip()));
      }
      edited = setKeys(f, existing, fields, nl);
    } else {
      Map<String, String> item = new LinkedHashMap<>();
      item.put("stage", stage);
      item.putAll(fields);
      if (ov == null) {
        String ind = " ".repeat(vnode.col() - 1);
        edited = insertAfterLineOf(f.text, vnode.end(), ind + "overrides:" + nl
            + item(item, ind + "  ", nl), nl);
      } else if (ov instanceof SeqNode seq && !seq.flow()) {
        edited = insertAfterLineOf(f.text, seq.end(), item(item, dashIndent(f, seq), nl), nl);
      } else if (ov instanceof SeqNode seq && seq.items().isEmpty()) {
        edited = replaceFlowWithBlock(f.text, seq,
            item(item, " ".repeat(vnode.col() - 1) + "  ", nl), nl);
      } else {
        throw BadInputException.at(f.file + ":" + ov.line(), "the overrides of " + variety
            + " are written in flow style; write them as a block list so they can be edited here");
      }
    }
    Crop after = check(f, edited);
    Variety va = after.variety(variety).orElseThrow();
    EffectiveStage now = Inheritance.resolve(after, va, (l, m) -> { }).stage(stage).orElseThrow();
    if (t10 != null && Math.abs(now.t10C() - t10) > 1e-9 || t90 != null && Math.abs(now.t90C() - t90) > 1e-9) {
      throw new IllegalStateException("the edited file does not give the value asked for; nothing"
          + " written");
    }
    write(f, edited);
    List<ProfileEdit> edits = new ArrayList<>();
    if (t10 != null) {
      edits.add(new ProfileEdit(clock.instant(), by.strip(), f.file, crop, variety, stage, "t10",
          before.t10C(), now.t10C(), note.strip()));
    }
    if (t90 != null) {
      edits.add(new ProfileEdit(clock.instant(), by.strip(), f.file, crop, variety, stage, "t90",
          before.t90C(), now.t90C(), note.strip()));
    }
    return edits;
  }

  private record Loaded(Path path, String file, String text, MapNode root, Crop crop) {}

  private Loaded load(String crop) {
    if (BundledData.isReadOnly(dir)) {
      throw new BadInputException("the crop profiles in use (" + dir + ") are the copy packed inside"
          + " the rimeward jar, which cannot be changed. Copy the crop-profiles folder somewhere"
          + " you can write and pass it with --crop-profiles DIR");
    }
    Path path = dir.resolve(crop + CropLibrary.EXTENSION);
    if (!CropFileReader.ID.matcher(crop).matches() || !Files.isRegularFile(path)) {
      throw new BadInputException("unknown crop '" + crop + "' in " + dir + "; known crops: "
          + knownCrops());
    }
    if (!Files.isWritable(path)) {
      throw new BadInputException(path + ": the file cannot be written; check its permissions or"
          + " pass a folder you can write with --crop-profiles DIR");
    }
    String text;
    try {
      text = Files.readString(path, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new BadInputException(path + ": cannot be read: " + e.getMessage(), e);
    }
    List<String> problems = new ArrayList<>();
    Crop c = CropFileReader.read(text, path.toString(), crop, problems);
    if (c == null) {
      throw new BadInputException("fix these problems in " + path + " before editing it"
          + " (rimeward profile check lists them):" + System.lineSeparator()
          + String.join(System.lineSeparator(), problems));
    }
    return new Loaded(path, path.toString(), text, CropFileReader.parse(text, path.toString()), c);
  }

  private String knownCrops() {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(CropLibrary.EXTENSION))
          .map(n -> n.substring(0, n.length() - CropLibrary.EXTENSION.length())).sorted()
          .collect(Collectors.joining(", "));
    } catch (IOException e) {
      return "(the folder cannot be listed)";
    }
  }

  private Crop check(Loaded f, String edited) {
    List<String> problems = new ArrayList<>();
    Crop c;
    try {
      c = CropFileReader.read(edited, f.file, f.crop.id(), problems);
    } catch (BadInputException e) {
      throw new BadInputException("the change was not written: " + e.getMessage(), e);
    }
    if (c == null) {
      throw new BadInputException("the change was not written, because the file would then have"
          + " these problems:" + System.lineSeparator() + String.join(System.lineSeparator(), problems));
    }
    return c;
  }

  private void write(Loaded f, String edited) {
    try {
      writer.write(f.path, edited);
    } catch (IOException e) {
      throw new BadInputException(f.file + ": the change could not be written (" + e.getMessage()
          + "); the file is unchanged", e);
    }
  }

  private static void requireNote(String note, String by) {
    if (note == null || note.isBlank()) {
      throw new BadInputException("--note is required: say who observed what, and when (for example"
          + " \"bud cuts 2024-04-12, block 4: 10% dead at -3 C\")");
    }
    if (by == null || by.isBlank()) {
      throw new BadInputException("--by: give the name of the person making the change");
    }
  }

  private static BadInputException unknownVariety(Crop crop, String variety) {
    return new BadInputException("unknown variety '" + variety + "' of crop '" + crop.id()
        + "'; known varieties: " + (crop.varieties().isEmpty() ? "(none)" : crop.varieties().stream()
        .map(Variety::id).collect(Collectors.joining(", ")))
        + ". Add it with rimeward profile new-variety " + crop.id() + "/" + variety + " --note ...");
  }

  private String today() {
    return LocalDate.ofInstant(clock.instant(), clock.getZone()).toString();
  }

  private static MapNode varietyNode(MapNode root, String id) {
    for (Node n : ((SeqNode) root.get("varieties")).items()) {
      MapNode m = (MapNode) n;
      if (id.equals(((Scalar) m.get("id")).text().strip())) {
        return m;
      }
    }
    throw new IllegalStateException("variety " + id + " not in the tree");
  }

  private static MapNode overrideNode(SeqNode overrides, String stage) {
    for (Node n : overrides.items()) {
      if (n instanceof MapNode m && m.get("stage") instanceof Scalar s && stage.equals(s.text().strip())) {
        return m;
      }
    }
    return null;
  }

  /** Replaces the keys {@code m} has, and adds the others after its last line. */
  private static String setKeys(Loaded f, MapNode m, Map<String, String> fields, String nl) {
    if (m.flow()) {
      throw BadInputException.at(f.file + ":" + m.line(), "this override is written in flow style"
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
        throw BadInputException.at(f.file + ":" + n.line(), e.getKey() + ": expected a single value");
      }
    }
    // The added lines go after every scalar of this mapping, so the scalars' offsets still hold;
    // replacing from the last one backwards keeps the earlier offsets valid too.
    StringBuilder text = new StringBuilder(added.length() == 0 ? f.text
        : insertAfterLineOf(f.text, m.end(), added.toString(), nl));
    List<Integer> order = new ArrayList<>();
    for (int i = 0; i < replace.size(); i++) {
      order.add(i);
    }
    order.sort((x, y) -> Integer.compare(replace.get(y).start(), replace.get(x).start()));
    for (int i : order) {
      text.replace(replace.get(i).start(), replace.get(i).end(), with.get(i));
    }
    return text.toString();
  }

  private static void copyScalar(String text, MapNode from, String key, Map<String, String> fields) {
    if (from.get(key) instanceof Scalar s && !s.isNull()) {
      fields.put(key, raw(text, s));
    }
  }

  private static String copiedOverrides(String text, MapNode from, String ind, String nl) {
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

  private static String raw(String text, Scalar s) {
    String r = text.substring(s.start(), s.end());
    return r.contains("\n") || r.contains("\r") ? quote(s.text()) : r;
  }

  /** One block-sequence item: the first key after {@code dash + "- "}, the rest aligned under it. */
  private static String item(Map<String, String> fields, String dash, String nl) {
    StringBuilder b = new StringBuilder();
    String ind = dash + "  ";
    boolean first = true;
    for (Map.Entry<String, String> e : fields.entrySet()) {
      b.append(first ? dash + "- " : ind).append(e.getKey()).append(": ").append(e.getValue()).append(nl);
      first = false;
    }
    return b.toString();
  }

  private static String dashIndent(Loaded f, SeqNode seq) {
    Node first = seq.items().get(0);
    int lineStart = f.text.lastIndexOf('\n', Math.max(0, first.start() - 1)) + 1;
    int dashCol = first.col() - 3;
    if (dashCol < 0 || f.text.charAt(lineStart + dashCol) != '-'
        || f.text.charAt(lineStart + dashCol + 1) != ' ') {
      throw BadInputException.at(f.file + ":" + first.line(), "this list is not laid out as '- key:"
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

  private static String replaceFlowWithBlock(String text, SeqNode seq, String block, String nl) {
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

  private static String remove(String text, Entry e, String nl) {
    int lineStart = text.lastIndexOf('\n', Math.max(0, e.value().end() - 1)) + 1;
    int lineEnd = text.indexOf('\n', e.value().end());
    return text.substring(0, lineStart) + (lineEnd < 0 ? "" : text.substring(lineEnd + 1));
  }

  private static String ensureNewline(String text, String nl) {
    return text.isEmpty() || text.endsWith("\n") ? text : text + nl;
  }

  private static String newline(String text) {
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
