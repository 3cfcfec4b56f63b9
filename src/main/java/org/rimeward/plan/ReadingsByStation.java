package org.rimeward.plan;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.farm.Station;
import org.rimeward.io.BadInputException;
import org.rimeward.weather.Reading;
import org.rimeward.weather.Readings;

/**
 * Which station's readings correct each block's forecast in a re-plan, and the rows of each.
 *
 * <p>When farm.yaml declares {@code stations:}, a block is corrected by the station that lists it
 * (which hangs in it, so its readings are the block's air) or else by the default station (which
 * the block keeps its cold-air offset against). Rows without a station id are the default
 * station's: a file written by one logger names none. Rows of a station farm.yaml does not declare
 * are not used, and counted: taking a mistyped id for the default thermometer would correct
 * blocks by air nobody placed a thermometer in.
 *
 * <p>When farm.yaml declares none, or {@code --station} names one, one station stands for every
 * block: the one named, the only one in the file, or the one running coldest against the
 * forecast; the others are listed and not used.
 *
 * @param sources every station in farm.yaml or the file, planning ones first, in farm.yaml order
 * @param main the station whose figures head the summary: the default, or the one planned by
 * @param overridden whether {@code --station} chose the station for every block
 */
record ReadingsByStation(List<Source> sources, String main, boolean overridden) {
  /**
   * One station as the re-plan uses it.
   *
   * @param declared farm.yaml's declaration, if any
   * @param readings its rows, in time order
   * @param blocks the blocks it corrects (none: it is not used)
   * @param listed the blocks it hangs in, whose readings are their air
   * @param note what the grower should know about it (empty: nothing)
   */
  record Source(String id, Optional<Station> declared, List<Reading> readings, List<String> blocks,
      List<String> listed, String note) {}

  /** The station correcting {@code blockId}. */
  Source sourceOf(String blockId) {
    return sources.stream().filter(s -> s.blocks().contains(blockId)).findFirst().orElseThrow();
  }

  /**
   * Splits {@code readings} by station. {@code biasC} gives a station's offset against the
   * forecast over the last hour, to choose the coldest when nothing else says which to use.
   */
  static ReadingsByStation of(Farm farm, Readings readings, Optional<String> override,
      Function<List<Reading>, Double> biasC) {
    List<String> inFile = readings.stations();
    List<String> all = farm.blocks().stream().map(Block::id).toList();
    if (farm.stations().isEmpty() || override.isPresent()) {
      String used = override.orElseGet(() -> coldest(readings, biasC));
      if (!inFile.isEmpty() && !inFile.contains(used)) {
        throw new BadInputException("--station: '" + used + "' has no readings in "
            + readings.file().getFileName() + "; stations there: " + String.join(", ", inFile));
      }
      List<Source> sources = new ArrayList<>();
      sources.add(new Source(used, farm.station(used), readings.of(used), all, List.of(),
          override.isPresent() && !farm.stations().isEmpty() ? "--station: every block is planned by"
              + " this station's readings, whatever farm.yaml's stations say" : ""));
      for (String id : inFile) {
        if (!id.equals(used)) {
          sources.add(new Source(id, farm.station(id), readings.of(id), List.of(), List.of(),
              "not planned by: the plan follows " + shown(used)));
        }
      }
      return new ReadingsByStation(sources, used, override.isPresent());
    }
    List<Source> sources = new ArrayList<>();
    Optional<Station> fallback = farm.defaultStation();
    for (Station st : farm.stations()) {
      List<Reading> rows = new ArrayList<>(readings.of(st.id()));
      if (st.isDefault() && inFile.contains("")) {
        rows.addAll(readings.of(""));
        rows.sort(Comparator.comparing(Reading::time));
      }
      List<String> blocks = all.stream()
          .filter(b -> farm.stationOf(b).filter(st::equals).isPresent()).toList();
      sources.add(new Source(st.id(), Optional.of(st), rows, blocks, st.blockIds(), rows.isEmpty()
          ? "no readings in " + readings.file().getFileName() + " yet" : ""));
    }
    for (String id : inFile) {
      if (farm.station(id).isPresent() || id.isEmpty() && fallback.isPresent()) {
        continue;
      }
      int n = readings.of(id).size();
      sources.add(new Source(id, Optional.empty(), readings.of(id), List.of(), List.of(), id.isEmpty()
          ? n + " row(s) name no station and no station is the default: not used; fill the"
              + " station column, or mark a station default: true in farm.yaml"
          : n + " row(s) not used: farm.yaml's stations do not declare it; declare it (id, height,"
              + " blocks) or correct the logger's station id"));
    }
    String main = fallback.map(Station::id).orElse(sources.stream()
        .filter(s -> !s.blocks().isEmpty()).findFirst().orElseThrow().id());
    return new ReadingsByStation(sources, main, false);
  }

  /** The station whose readings run coldest against the forecast over the last hour. */
  private static String coldest(Readings readings, Function<List<Reading>, Double> biasC) {
    List<String> stations = readings.stations();
    if (stations.size() <= 1) {
      return stations.isEmpty() ? "" : stations.get(0);
    }
    Map<String, Double> bias = new LinkedHashMap<>();
    for (String s : stations) {
      double b = biasC.apply(readings.of(s));
      bias.put(s, Double.isNaN(b) ? Double.MAX_VALUE : b);
    }
    return stations.stream().min(Comparator.comparingDouble(bias::get)).orElseThrow();
  }

  static String shown(String id) {
    return id.isEmpty() ? "the file's unnamed station" : "station " + id;
  }
}
