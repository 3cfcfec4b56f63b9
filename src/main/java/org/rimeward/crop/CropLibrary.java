package org.rimeward.crop;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Problems;
import org.rimeward.io.TextFile;

/**
 * All crop profiles of one folder: one {@code CROP.yaml} per crop, varieties inside it. Read with
 * {@link Files} only, so the folder may also be the copy inside the jar.
 */
public final class CropLibrary {
  /** The extension of a crop file; the file name before it is the crop's id. */
  public static final String EXTENSION = ".yaml";

  private final Path dir;
  private final List<Crop> crops;

  private CropLibrary(Path dir, List<Crop> crops) {
    this.dir = dir;
    this.crops = List.copyOf(crops);
  }

  /**
   * Reads and checks every crop file in {@code dir}.
   *
   * @throws BadInputException listing every problem found, one per line, each with file and line
   */
  public static CropLibrary load(Path dir) {
    if (!Files.isDirectory(dir)) {
      throw new BadInputException(dir + ": no such crop-profiles folder; pass an existing folder"
          + " with --crop-profiles DIR");
    }
    List<Path> files;
    try (Stream<Path> s = Files.list(dir)) {
      files = s.filter(Files::isRegularFile).sorted().collect(Collectors.toList());
    } catch (IOException e) {
      throw new BadInputException(dir + ": cannot list the crop-profiles folder: " + e.getMessage(), e);
    }
    List<String> problems = new ArrayList<>();
    List<Crop> crops = new ArrayList<>();
    for (Path f : files) {
      String name = f.getFileName().toString();
      if (name.endsWith(".yml")) {
        problems.add(f + ": crop files end in .yaml; rename it to "
            + name.substring(0, name.length() - 4) + EXTENSION);
        continue;
      }
      if (!name.endsWith(EXTENSION) || name.startsWith(".")) {
        continue;
      }
      Crop c = readFile(f, problems);
      if (c != null) {
        crops.add(c);
      }
    }
    if (!problems.isEmpty()) {
      throw new BadInputException(String.join(System.lineSeparator(), problems));
    }
    if (crops.isEmpty()) {
      throw new BadInputException(dir + ": no crop files (*.yaml) in this folder; pass the"
          + " crop-profiles folder with --crop-profiles DIR");
    }
    return new CropLibrary(dir, crops);
  }

  static Crop readFile(Path f, List<String> problems) {
    String name = f.getFileName().toString();
    try {
      String text = TextFile.read(f, TextFile.MAX_DOCUMENT_BYTES, "crop file",
          "give the crop-profiles folder with --crop-profiles DIR").text();
      Problems found = new Problems(f.toString());
      Crop crop = CropFileReader.read(text, name.substring(0, name.length() - EXTENSION.length()),
          found);
      problems.addAll(found.all());
      return crop;
    } catch (BadInputException e) {
      problems.add(e.getMessage());
      return null;
    }
  }

  public Path dir() {
    return dir;
  }

  /** The crops, sorted by id. */
  public List<Crop> crops() {
    return crops;
  }

  public Optional<Crop> crop(String id) {
    return crops.stream().filter(c -> c.id().equals(id)).findFirst();
  }

  /**
   * What a check tells though nothing is wrong, one line per stage with its file and line: each
   * stage written without a {@code flowering} flag, how its BBCH code was read, and what to write.
   */
  public List<String> notes() {
    List<String> out = new ArrayList<>();
    for (Crop c : crops) {
      for (Stage s : c.stages()) {
        if (s.floweringFlag() == null) {
          out.add(c.file() + ":" + s.line() + ": stages[" + s.id() + "]: has no flowering flag, so"
              + " it is read from bbch " + s.bbch() + " as " + (s.flowering() ? "flowering" : "not"
              + " flowering") + " (" + Stage.FIRST_FLOWERING_BBCH + " to " + Stage.LAST_FLOWERING_BBCH
              + " flower); " + StageReader.FLOWERING_HINT);
        }
      }
    }
    return out;
  }

  /**
   * The stage table for {@code crop}, or for its variety when {@code varietyOrNull} is given.
   *
   * @throws BadInputException naming the unknown crop or variety and listing the known ones
   */
  public EffectiveProfile effective(String crop, String varietyOrNull) {
    Crop c = require(crop);
    Variety v = null;
    if (varietyOrNull != null) {
      v = c.variety(varietyOrNull).orElseThrow(() -> new BadInputException("unknown variety '"
          + varietyOrNull + "' of crop '" + crop + "'; known varieties: "
          + (c.varieties().isEmpty() ? "(none; use the crop alone, or add one with rimeward profile"
              + " new-variety)" : c.varieties().stream().map(Variety::id)
              .collect(Collectors.joining(", ")))));
    }
    Problems problems = new Problems(c.file());
    EffectiveProfile p = Inheritance.resolve(c, v, problems::add);
    problems.throwIfAny();
    return p;
  }

  /** Resolves {@code CROP} or {@code CROP/VARIETY}. */
  public EffectiveProfile effective(String cropSlashVariety) {
    int i = cropSlashVariety.indexOf('/');
    return i < 0 ? effective(cropSlashVariety, null)
        : effective(cropSlashVariety.substring(0, i), cropSlashVariety.substring(i + 1));
  }

  Crop require(String crop) {
    return crop(crop).orElseThrow(() -> new BadInputException("unknown crop '" + crop
        + "'; known crops: " + crops.stream().map(Crop::id).collect(Collectors.joining(", "))));
  }
}
