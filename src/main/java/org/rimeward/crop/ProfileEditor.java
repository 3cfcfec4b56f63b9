package org.rimeward.crop;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.stream.Collectors;
import static org.rimeward.crop.YamlSplice.copiedOverrides;
import static org.rimeward.crop.YamlSplice.copyScalar;
import static org.rimeward.crop.YamlSplice.dashIndent;
import static org.rimeward.crop.YamlSplice.ensureNewline;
import static org.rimeward.crop.YamlSplice.insertAfterLineOf;
import static org.rimeward.crop.YamlSplice.item;
import static org.rimeward.crop.YamlSplice.newline;
import static org.rimeward.crop.YamlSplice.overrideNode;
import static org.rimeward.crop.YamlSplice.quote;
import static org.rimeward.crop.YamlSplice.remove;
import static org.rimeward.crop.YamlSplice.replaceFlowWithBlock;
import static org.rimeward.crop.YamlSplice.setKeys;
import static org.rimeward.crop.YamlSplice.varietyNode;
import static org.rimeward.crop.YamlSplice.withUnit;

import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.io.BadInputException;
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

  private final Clock clock;
  private final CropFileEdits files;

  public ProfileEditor(Path dir, Clock clock) {
    this(dir, clock, CropFileWriter::replace);
  }

  public ProfileEditor(Path dir, Clock clock, TextWriter writer) {
    this.clock = Objects.requireNonNull(clock, "clock");
    this.files = new CropFileEdits(Objects.requireNonNull(dir, "dir"),
        Objects.requireNonNull(writer, "writer"));
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
    return newVariety(crop, variety, name, fromVariety, offsetText, bareAs, note, by,
        EditJournal.NONE);
  }

  /** As above, reporting the change to {@code journal} before and after the file is written. */
  public ProfileEdit newVariety(String crop, String variety, String name, String fromVariety,
      String offsetText, UnitSystem bareAs, String note, String by, EditJournal journal) {
    requireNote(note, by);
    return files.locked(crop, f -> newVariety(f, variety, name, fromVariety, offsetText, bareAs, note,
        by, journal));
  }

  private ProfileEdit newVariety(CropFileEdits.Loaded f, String variety, String name, String fromVariety,
      String offsetText, UnitSystem bareAs, String note, String by, EditJournal journal) {
    String crop = f.crop().id();
    if (!CropFields.ID.matcher(variety).matches()) {
      throw new BadInputException("variety '" + variety + "' is not a kebab-case id; use lower case"
          + " letters, digits and single hyphens, e.g. honeycrisp or gala-early");
    }
    f.crop().variety(variety).ifPresent(v -> {
      throw BadInputException.at(f.file() + ":" + v.line(), "variety '" + variety + "' already"
          + " exists; change its values with rimeward profile set");
    });
    String nl = newline(f.text());
    Map<String, String> fields = new LinkedHashMap<>();
    fields.put("id", variety);
    fields.put("name", quote(name == null || name.isBlank() ? variety : name.strip()));
    MapNode from = null;
    if (fromVariety != null) {
      f.crop().variety(fromVariety).orElseThrow(() -> unknownVariety(f.crop(), fromVariety));
      from = varietyNode(f.root(), fromVariety);
      copyScalar(f.text(), from, "hardiness_offset", fields);
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

    Node vs = f.root().get("varieties");
    String edited;
    if (vs == null || vs instanceof Scalar sc && sc.isNull()) {
      String base = vs == null ? f.text() : remove(f.text(), f.root().entries().get("varieties"), nl);
      String block = item(fields, "  ", nl) + copiedOverrides(f.text(), from, "    ", nl);
      edited = ensureNewline(base, nl) + nl + "varieties:" + nl + block;
    } else if (vs instanceof SeqNode seq && !seq.flow()) {
      String dash = dashIndent(f.file(), f.text(), seq);
      String block = item(fields, dash, nl) + copiedOverrides(f.text(), from, dash + "  ", nl);
      edited = insertAfterLineOf(f.text(), seq.end(), block, nl);
    } else if (vs instanceof SeqNode seq && seq.items().isEmpty()) {
      String dash = "  ";
      String block = item(fields, dash, nl) + copiedOverrides(f.text(), from, dash + "  ", nl);
      edited = replaceFlowWithBlock(f.text(), seq, block, nl);
    } else {
      throw BadInputException.at(f.file() + ":" + vs.line(), "varieties are written in flow style"
          + " ([...]); write them as a block list ('- id: ...') so they can be edited here");
    }
    Crop after = files.check(f, edited);
    Variety v = after.variety(variety).orElseThrow(() -> new IllegalStateException(
        "the new variety was not found after the edit; nothing written"));
    Double offset = v.hardinessOffsetC() == 0 ? null : v.hardinessOffsetC();
    ProfileEdit edit = new ProfileEdit(clock.instant(), by.strip(), f.file(), crop, variety, null,
        "variety", null, offset, note.strip());
    files.commit(f, edited, List.of(edit), journal);
    return edit;
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
    return set(crop, variety, stage, t10Text, t90Text, bareAs, note, by, EditJournal.NONE);
  }

  /** As above, reporting the change to {@code journal} before and after the file is written. */
  public List<ProfileEdit> set(String crop, String variety, String stage, String t10Text,
      String t90Text, UnitSystem bareAs, String note, String by, EditJournal journal) {
    requireNote(note, by);
    if (t10Text == null && t90Text == null) {
      throw new BadInputException("nothing to set: give --t10 and/or --t90");
    }
    if (variety == null) {
      throw new BadInputException("profile set changes a variety, not the published base table of '"
          + crop + "'; add a variety with rimeward profile new-variety " + crop + "/NAME --note ...,"
          + " then set its values");
    }
    return files.locked(crop, f -> set(f, variety, stage, t10Text, t90Text, bareAs, note, by, journal));
  }

  private List<ProfileEdit> set(CropFileEdits.Loaded f, String variety, String stage, String t10Text,
      String t90Text, UnitSystem bareAs, String note, String by, EditJournal journal) {
    String crop = f.crop().id();
    Variety v = f.crop().variety(variety).orElseThrow(() -> unknownVariety(f.crop(), variety));
    f.crop().stage(stage).orElseThrow(() -> new BadInputException("unknown stage '" + stage
        + "' of crop '" + crop + "'; known stages: " + f.crop().stages().stream().map(Stage::id)
        .collect(Collectors.joining(", "))));
    EffectiveStage before = Inheritance.resolve(f.crop(), v, (l, m) -> { }).stage(stage).orElseThrow();
    Double t10 = t10Text == null ? null : Quantities.parse(t10Text, Dimension.TEMPERATURE, "--t10", bareAs);
    Double t90 = t90Text == null ? null : Quantities.parse(t90Text, Dimension.TEMPERATURE, "--t90", bareAs);

    String nl = newline(f.text());
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

    MapNode vnode = varietyNode(f.root(), variety);
    Node ov = vnode.get("overrides");
    String edited;
    MapNode existing = ov instanceof SeqNode s ? overrideNode(s, stage) : null;
    if (existing != null) {
      if (existing.get("tolerance") != null) {
        throw BadInputException.at(f.file() + ":" + existing.line(), "the " + variety + " override of '"
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
      edited = setKeys(f.file(), f.text(), existing, fields, nl);
    } else {
      Map<String, String> item = new LinkedHashMap<>();
      item.put("stage", stage);
      item.putAll(fields);
      if (ov == null) {
        String ind = " ".repeat(vnode.col() - 1);
        edited = insertAfterLineOf(f.text(), vnode.end(), ind + "overrides:" + nl
            + item(item, ind + "  ", nl), nl);
      } else if (ov instanceof SeqNode seq && !seq.flow()) {
        edited = insertAfterLineOf(f.text(), seq.end(), item(item, dashIndent(f.file(), f.text(), seq), nl), nl);
      } else if (ov instanceof SeqNode seq && seq.items().isEmpty()) {
        edited = replaceFlowWithBlock(f.text(), seq,
            item(item, " ".repeat(vnode.col() - 1) + "  ", nl), nl);
      } else {
        throw BadInputException.at(f.file() + ":" + ov.line(), "the overrides of " + variety
            + " are written in flow style; write them as a block list so they can be edited here");
      }
    }
    Crop after = files.check(f, edited);
    Variety va = after.variety(variety).orElseThrow();
    EffectiveStage now = Inheritance.resolve(after, va, (l, m) -> { }).stage(stage).orElseThrow();
    if (t10 != null && Math.abs(now.t10C() - t10) > 1e-9 || t90 != null && Math.abs(now.t90C() - t90) > 1e-9) {
      throw new IllegalStateException("the edited file does not give the value asked for; nothing"
          + " written");
    }
    List<ProfileEdit> edits = new ArrayList<>();
    if (t10 != null) {
      edits.add(new ProfileEdit(clock.instant(), by.strip(), f.file(), crop, variety, stage, "t10",
          before.t10C(), now.t10C(), note.strip()));
    }
    if (t90 != null) {
      edits.add(new ProfileEdit(clock.instant(), by.strip(), f.file(), crop, variety, stage, "t90",
          before.t90C(), now.t90C(), note.strip()));
    }
    files.commit(f, edited, edits, journal);
    return edits;
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

}
