package org.rimeward.farm;

import java.nio.file.Path;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.Collections;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * A farm as read from its farm.yaml: where it is, its protection policy, its water and its blocks
 * (in file order).
 *
 * @param name the farm's name
 * @param latitude degrees north (negative south), −90 to 90
 * @param longitude degrees east (negative west), −180 to 180
 * @param elevationM elevation above sea level, m
 * @param zone the farm's IANA time zone, used for local times in the forecast and the report
 * @param folder the farm folder (the one holding farm.yaml)
 * @param forecastFile the forecast CSV the farm names, resolved against the folder
 * @param policy how protection is decided
 * @param waterSources water sources in file order
 * @param blocks blocks in file order
 * @param origin the farm file (line 1), for messages and the audit
 * @param cropProfilesDir the crop-profiles folder farm.yaml names, resolved against the folder
 * @param rulesDir the rules folder farm.yaml names, resolved against the folder
 * @param contact who the weather services may contact about this farm's requests (an e-mail
 *     address or web page), sent with {@code forecast fetch} where a service asks for one
 * @param stations the thermometers farm.yaml declares, in file order (none: the readings file's
 *     one station, or the one chosen, stands for every block)
 */
public record Farm(
    String name,
    double latitude,
    double longitude,
    double elevationM,
    ZoneId zone,
    Path folder,
    Path forecastFile,
    Policy policy,
    List<WaterSource> waterSources,
    List<Block> blocks,
    SourceRef origin,
    Optional<Path> cropProfilesDir,
    Optional<Path> rulesDir,
    Optional<String> contact,
    List<Station> stations) {

  /** Elevations accepted, m: the range the station-pressure formula is used over, one range. */
  public static final double MIN_ELEVATION_M = org.rimeward.physics.Atmosphere.MIN_ELEVATION_M;
  public static final double MAX_ELEVATION_M = org.rimeward.physics.Atmosphere.MAX_ELEVATION_M;
  /** The folders a farm folder may hold its own inputs in, when farm.yaml names none. */
  public static final String DEFAULT_CROP_PROFILES = "crop-profiles";
  public static final String DEFAULT_RULES = "rules";

  public Farm {
    if (name == null || name.isBlank()) {
      throw new IllegalArgumentException("farm name is required");
    }
    if (!(latitude >= -90 && latitude <= 90)) {
      throw new IllegalArgumentException("latitude " + latitude + " is outside -90 to 90");
    }
    if (!(longitude >= -180 && longitude <= 180)) {
      throw new IllegalArgumentException("longitude " + longitude + " is outside -180 to 180");
    }
    if (!(elevationM >= MIN_ELEVATION_M && elevationM <= MAX_ELEVATION_M)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "elevation %s m is outside %.0f to %.0f m", elevationM, MIN_ELEVATION_M, MAX_ELEVATION_M));
    }
    Objects.requireNonNull(zone, "zone");
    if (zone instanceof ZoneOffset) {
      throw new IllegalArgumentException("time zone must be a named zone, not the fixed offset " + zone);
    }
    Objects.requireNonNull(folder, "folder");
    Objects.requireNonNull(forecastFile, "forecastFile");
    Objects.requireNonNull(policy, "policy");
    Objects.requireNonNull(origin, "origin");
    Objects.requireNonNull(cropProfilesDir, "cropProfilesDir");
    Objects.requireNonNull(rulesDir, "rulesDir");
    Objects.requireNonNull(contact, "contact");
    waterSources = List.copyOf(waterSources);
    blocks = List.copyOf(blocks);
    if (blocks.isEmpty()) {
      throw new IllegalArgumentException("farm " + name + " has no blocks");
    }
    Set<String> sourceIds = new HashSet<>();
    for (WaterSource s : waterSources) {
      if (!sourceIds.add(s.id())) {
        throw new IllegalArgumentException("water source id " + s.id() + " is used twice");
      }
    }
    Set<String> blockIds = new HashSet<>();
    for (Block b : blocks) {
      if (!blockIds.add(b.id())) {
        throw new IllegalArgumentException("block id " + b.id() + " is used twice");
      }
      b.sprinklers().ifPresent(s -> {
        if (!sourceIds.contains(s.sourceId())) {
          throw new IllegalArgumentException("block " + b.id() + " draws on water source "
              + s.sourceId() + ", which the farm does not have");
        }
      });
    }
    stations = List.copyOf(stations);
    Set<String> stationIds = new HashSet<>();
    Set<String> listed = new HashSet<>();
    long defaults = 0;
    for (Station st : stations) {
      if (!stationIds.add(st.id())) {
        throw new IllegalArgumentException("station id " + st.id() + " is used twice");
      }
      defaults += st.isDefault() ? 1 : 0;
      for (String b : st.blockIds()) {
        if (!blockIds.contains(b)) {
          throw new IllegalArgumentException("station " + st.id() + " stands for block " + b
              + ", which the farm does not have");
        }
        if (!listed.add(b)) {
          throw new IllegalArgumentException("block " + b + " is listed under two stations");
        }
      }
    }
    if (defaults > 1) {
      throw new IllegalArgumentException("more than one station is the default");
    }
    if (!stations.isEmpty() && defaults == 0 && listed.size() < blocks.size()) {
      throw new IllegalArgumentException("some blocks have no station and no station is the default");
    }
  }

  /** The station that stands for the blocks no station lists, if farm.yaml declares one. */
  public Optional<Station> defaultStation() {
    return stations.stream().filter(Station::isDefault).findFirst();
  }

  /** The station whose readings stand for {@code blockId}: the one listing it, else the default. */
  public Optional<Station> stationOf(String blockId) {
    return listedStation(blockId).or(this::defaultStation);
  }

  /** The station that lists {@code blockId}, hanging in that block, if any. */
  public Optional<Station> listedStation(String blockId) {
    return stations.stream().filter(s -> s.blockIds().contains(blockId)).findFirst();
  }

  public Optional<Station> station(String id) {
    return stations.stream().filter(s -> s.id().equals(id)).findFirst();
  }

  /** The farm folder's own crop profiles: the folder farm.yaml names, else {@code crop-profiles/} there. */
  public Optional<Path> ownCropProfiles() {
    return cropProfilesDir.or(() -> existing(folder.resolve(DEFAULT_CROP_PROFILES)));
  }

  /** The farm folder's own rules: the folder farm.yaml names, else {@code rules/} there. */
  public Optional<Path> ownRules() {
    return rulesDir.or(() -> existing(folder.resolve(DEFAULT_RULES)));
  }

  private static Optional<Path> existing(Path dir) {
    return java.nio.file.Files.isDirectory(dir) ? Optional.of(dir) : Optional.empty();
  }

  /** The farm file itself, for the audit (its bytes can be read from here). */
  public Path sourceFile() {
    return Path.of(origin.file());
  }

  public Optional<Block> block(String id) {
    return blocks.stream().filter(b -> b.id().equals(id)).findFirst();
  }

  public Optional<WaterSource> waterSource(String id) {
    return waterSources.stream().filter(s -> s.id().equals(id)).findFirst();
  }

  /** Blocks whose sprinklers draw on {@code sourceId}, in file order. */
  public List<Block> blocksOn(String sourceId) {
    return blocks.stream()
        .filter(b -> b.sprinklers().map(s -> s.sourceId().equals(sourceId)).orElse(false))
        .toList();
  }

  /** Blocks by id, iterating in file order. */
  public Map<String, Block> blocksById() {
    Map<String, Block> m = new LinkedHashMap<>();
    blocks.forEach(b -> m.put(b.id(), b));
    return Collections.unmodifiableMap(m);
  }
}
