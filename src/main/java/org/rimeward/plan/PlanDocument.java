package org.rimeward.plan;

import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonProperty;
import com.fasterxml.jackson.annotation.JsonSubTypes;
import com.fasterxml.jackson.annotation.JsonTypeInfo;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.annotation.JsonSerialize;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;
import org.rimeward.io.Json.Decimals;

/**
 * The plan document: the one shape of a nightly plan that Jackson writes ({@code plan --format
 * json}, the audit trail) and reads back (audit show, why, export, replay, the report pages).
 * Always metric; keys are the components' names in snake_case; times are local with their offset.
 * A key is added by adding a component here and its value in {@link PlanDocuments}; existing keys
 * keep their meaning, and a reader ignores keys it does not know, so older records still read.
 */
public record PlanDocument(
    String farm,
    String toolVersion,
    Night night,
    Policy policy,
    Inputs inputs,
    List<Block> blocks,
    List<Water> water,
    List<String> cautions,
    List<Rule> farmRules,
    List<TimelineEntry> timeline,
    @JsonInclude(JsonInclude.Include.NON_NULL) OffsetDateTime now,
    @JsonInclude(JsonInclude.Include.NON_NULL) Readings readings,
    @JsonInclude(JsonInclude.Include.NON_NULL) List<Change> changes) {
  /** A plan made at dusk: no {@code now}, {@code readings} or {@code changes}. */
  public PlanDocument(String farm, String toolVersion, Night night, Policy policy, Inputs inputs,
      List<Block> blocks, List<Water> water, List<String> cautions, List<Rule> farmRules,
      List<TimelineEntry> timeline) {
    this(farm, toolVersion, night, policy, inputs, blocks, water, cautions, farmRules, timeline,
        null, null,
        null);
  }

  public PlanDocument {
    timeline = timeline == null ? List.of() : List.copyOf(timeline);
    blocks = blocks == null ? List.of() : List.copyOf(blocks);
    water = water == null ? List.of() : List.copyOf(water);
    cautions = cautions == null ? List.of() : List.copyOf(cautions);
    farmRules = farmRules == null ? List.of() : List.copyOf(farmRules);
  }

  /** The farm's time zone. */
  @JsonIgnore
  public ZoneId zone() {
    return ZoneId.of(night.zone());
  }

  /** The block with that id, if the plan has it. */
  public Optional<Block> block(String id) {
    return blocks.stream().filter(b -> b.block().equals(id)).findFirst();
  }

  /**
   * What the station's readings showed in a re-plan during the night (see {@code NightUpdate}).
   *
   * @param biasC observed − forecast air over the last hour, null when no reading fell in it
   * @param stale no reading in the last hour
   * @param points the planned-by station's air readings from the first forecast step to now
   */
  public record Readings(
      String file,
      OffsetDateTime lastAt,
      @JsonSerialize(using = Decimals.Two.class) Double biasC,
      @JsonSerialize(using = Decimals.Two.class) Double dewPointBiasC,
      List<StationReadings> stations,
      String station,
      String method,
      String methodText,
      int rows,
      int rowsSkipped,
      List<String> skipped,
      boolean stale,
      Integer staleAfterMin,
      SiteMinimum siteMinimum,
      @JsonInclude(JsonInclude.Include.NON_EMPTY) List<Point> points) {
    public Readings {
      stations = stations == null ? List.of() : List.copyOf(stations);
      skipped = skipped == null ? List.of() : List.copyOf(skipped);
      points = points == null ? List.of() : List.copyOf(points);
    }
  }

  /** One station reading of the air. */
  public record Point(OffsetDateTime at, @JsonSerialize(using = Decimals.Two.class) double airC) {}

  /** The site model's minimum beside the corrected forecast's (FAO 2005 ch. 6). */
  public record SiteMinimum(
      @JsonSerialize(using = Decimals.Two.class) double t0C,
      @JsonSerialize(using = Decimals.Two.class) double td0C,
      @JsonSerialize(using = Decimals.Two.class) double minAirC,
      @JsonSerialize(using = Decimals.Two.class) double intervalHalfWidthC,
      @JsonSerialize(using = Decimals.Two.class) Double forecastMinAirC,
      boolean used,
      String why) {}

  /** A decision that moved since the latest recorded plan for the night. */
  public record Change(String block, String what, String before, String after, String text) {}

  /** The night at the forecast point. */
  public record Night(
      LocalDate date,
      String zone,
      OffsetDateTime sunset,
      OffsetDateTime sunrise,
      OffsetDateTime coldestAt,
      @JsonSerialize(using = Decimals.Two.class) double minAirC) {}

  /**
   * Where the forecast, the crop profiles and the rules came from; null in runs recorded before
   * it was kept.
   */
  public record Inputs(Forecast forecast, Folder cropProfiles, Folder rules) {}

  /**
   * The forecast as used.
   *
   * @param format {@code csv}, {@code open-meteo}, {@code nws} or {@code met-norway}
   * @param notes how it was read: interpolation, properties coarser than hourly, a converted zone
   * @param fetched what {@code forecast fetch} recorded; null for a file not saved by it
   */
  public record Forecast(String file, String format, List<String> notes, Fetched fetched) {
    public Forecast {
      notes = notes == null ? List.of() : List.copyOf(notes);
    }
  }

  /** Where and when a fetched forecast came from; the URL without keys or passwords. */
  public record Fetched(String source, String url, String fetchedAt, String sha256, boolean unchanged) {}

  /**
   * A folder of crop profiles or rules.
   *
   * @param from {@code option}, {@code farm.yaml}, {@code farm folder} or {@code bundled}
   * @param sha256 over the files' names and contents, in name order
   */
  public record Folder(String from, String folder, String sha256) {}

  /** The policy as the farm file wrote it. */
  public record Policy(
      String target,
      @JsonSerialize(using = Decimals.Two.class) double startMarginC,
      String stopRule) {}

  /**
   * One block's plan.
   *
   * @param risk {@code none}, {@code watch}, {@code damage} or {@code severe}
   * @param status {@code not-needed}, {@code watch}, {@code protected}, {@code partly-protected},
   *     {@code short-of-water}, {@code not-advised}, {@code unprotected}
   * @param requiredRateMmH for a block with sprinklers: the largest need over the hours they
   *     would run; absent when they would not run tonight, or when the water balance cannot give
   *     the need at one of those hours ({@code notAdvisedBecause} then says {@code need-unknown})
   * @param installedRateMmH for a block with sprinklers: the installed (design) rate
   * @param sprinklingAdvised for a block whose sprinklers would run: whether that is advised
   * @param notAdvisedBecause for a block whose sprinklers would run: {@code wind},
   *     {@code rate-short}, {@code need-unknown}; empty when advised
   * @param startAirC the air temperature at which sprinkling starts, at the dew point forecast for
   *     its hour; with {@code startWetBulbC}, {@code alarmAirC} (a margin above it) and
   *     {@code alarmAt} (when the forecast air reaches the alarm; absent if it never does), for
   *     blocks that start sprinkling and near misses with sprinklers; a block granted no water
   *     (short water, or sprinkling not advised) has no alarm: its sprinklers stay off
   * @param coldAirOffsetC the farm file's offset of the block's air from the forecast's; a
   *     station reading plus this is the air at the block
   * @param cautions the explanations of the cautions that fired for the block
   * @param series the night step by step at the block; only for blocks at risk
   */
  public record Block(
      String block,
      String crop,
      String variety,
      String stage,
      String stageName,
      @JsonSerialize(using = Decimals.Two.class) double t10C,
      @JsonSerialize(using = Decimals.Two.class) double t90C,
      String thresholdSource,
      @JsonSerialize(using = Decimals.Two.class) double targetC,
      @JsonSerialize(using = Decimals.Two.class) double minAirC,
      @JsonSerialize(using = Decimals.Two.class) double minBudC,
      @JsonSerialize(using = Decimals.Two.class) double minWetBulbC,
      OffsetDateTime coldestAt,
      int coldestForecastLine,
      String risk,
      @JsonSerialize(using = Decimals.One.class) double killPctUnprotected,
      String status,
      @JsonInclude(JsonInclude.Include.NON_NULL) @JsonSerialize(using = Decimals.Two.class) Double requiredRateMmH,
      @JsonInclude(JsonInclude.Include.NON_NULL) @JsonSerialize(using = Decimals.Two.class) Double installedRateMmH,
      @JsonInclude(JsonInclude.Include.NON_NULL) Boolean sprinklingAdvised,
      @JsonInclude(JsonInclude.Include.NON_NULL) List<String> notAdvisedBecause,
      @JsonInclude(JsonInclude.Include.NON_NULL) @JsonSerialize(using = Decimals.Two.class) Double startAirC,
      @JsonInclude(JsonInclude.Include.NON_NULL) @JsonSerialize(using = Decimals.Two.class) Double startWetBulbC,
      @JsonInclude(JsonInclude.Include.NON_NULL) @JsonSerialize(using = Decimals.Two.class) Double alarmAirC,
      @JsonInclude(JsonInclude.Include.NON_NULL) OffsetDateTime alarmAt,
      @JsonSerialize(using = Decimals.Two.class) double coldAirOffsetC,
      List<Action> actions,
      List<String> cautions,
      List<Rule> rules,
      @JsonInclude(JsonInclude.Include.NON_EMPTY) List<Step> series) {
    public Block {
      actions = actions == null ? List.of() : List.copyOf(actions);
      cautions = cautions == null ? List.of() : List.copyOf(cautions);
      rules = rules == null ? List.of() : List.copyOf(rules);
      series = series == null ? List.of() : List.copyOf(series);
      notAdvisedBecause = notAdvisedBecause == null ? null : List.copyOf(notAdvisedBecause);
    }

    public Optional<Sprinkle> sprinkle() {
      return first(Sprinkle.class);
    }

    public Optional<Cover> cover() {
      return first(Cover.class);
    }

    /** The rules of kind caution that fired for the block, in firing order. */
    public List<Rule> cautionRules() {
      return rules.stream().filter(Rule::isCaution).toList();
    }

    /** Whether tonight threatens the block at all (any risk but none). */
    @JsonIgnore
    public boolean atRisk() {
      return !"none".equals(risk);
    }

    private <T> Optional<T> first(Class<T> type) {
      return actions.stream().filter(type::isInstance).map(type::cast).findFirst();
    }
  }

  /** Something to do on a block, named by its {@code method}. */
  @JsonTypeInfo(use = JsonTypeInfo.Id.NAME, property = "method")
  @JsonSubTypes({@JsonSubTypes.Type(value = Sprinkle.class, name = "sprinkle"),
      @JsonSubTypes.Type(value = Cover.class, name = "cover")})
  public sealed interface Action permits Sprinkle, Cover {
    /** When the action begins. */
    @JsonIgnore
    OffsetDateTime begins();

    /** When it ends; null when the forecast ends first. */
    @JsonIgnore
    OffsetDateTime ends();
  }

  /**
   * Over-plant sprinkling, as its source can carry it.
   *
   * @param start null, like {@code stop}, when the block gets no water (short water, or
   *     sprinkling not advised): no time a crew could read as "sprinkle"
   * @param designRateMmH the sprinklers' installed design rate
   * @param installedRateMmH the rate it runs at tonight: the design rate, or lower when short
   * @param flowM3H the granted draw; {@code waterM3} the granted water; {@code areaHa} protected
   * @param wantedFlowM3H the draw at the design rate over the whole block
   * @param waterGranted false when a short source leaves it dry: sprinklers off
   * @param grant {@code full}, {@code reduced-rate}, {@code sets}, {@code part-area}, {@code none}
   * @param sets the irrigation sets that run, when only some do
   * @param advised false when the rules advise against sprinkling tonight (wind, a rate short of
   *     the need): the need and rates are kept for the manager to weigh, not the times
   */
  public record Sprinkle(
      OffsetDateTime start,
      OffsetDateTime stop,
      boolean startsAtOnce,
      @JsonSerialize(using = Decimals.Two.class) double requiredRateMmH,
      @JsonSerialize(using = Decimals.Two.class) double designRateMmH,
      @JsonSerialize(using = Decimals.Two.class) double installedRateMmH,
      @JsonSerialize(using = Decimals.One.class) double flowM3H,
      @JsonSerialize(using = Decimals.Two.class) double areaHa,
      @JsonSerialize(using = Decimals.One.class) double waterM3,
      @JsonSerialize(using = Decimals.One.class) double wantedFlowM3H,
      @JsonSerialize(using = Decimals.One.class) double wantedWaterM3,
      String source,
      boolean waterGranted,
      String grant,
      List<String> sets,
      Boolean advised) implements Action {
    public Sprinkle {
      sets = sets == null ? List.of() : List.copyOf(sets);
    }

    /**
     * Whether sprinkling is advised; a run that is not advised is granted no water. Records
     * written before the key read as advised.
     */
    @JsonIgnore
    public boolean isAdvised() {
      return advised == null || advised;
    }

    @Override
    public OffsetDateTime begins() {
      return start;
    }

    @Override
    public OffsetDateTime ends() {
      return stop;
    }
  }

  /** Covers on from {@code deployStart}, by {@code deployBy}, off at {@code remove} (or null). */
  public record Cover(
      OffsetDateTime deployStart,
      OffsetDateTime deployBy,
      OffsetDateTime remove,
      @JsonSerialize(using = Decimals.Two.class) double protectionC,
      boolean sufficient) implements Action {
    @Override
    public OffsetDateTime begins() {
      return deployStart;
    }

    @Override
    public OffsetDateTime ends() {
      return remove;
    }
  }

  /**
   * One water source against tonight's demand.
   *
   * @param peakFlowM3H the largest draw the plan runs; {@code wantedPeakFlowM3H} at design rates
   * @param availableM3 null for a source with no volume limit
   * @param served blocks protected whole; {@code part} in part; {@code without} no water
   */
  public record Water(
      String source,
      @JsonSerialize(using = Decimals.One.class) double peakFlowM3H,
      @JsonSerialize(using = Decimals.One.class) double wantedPeakFlowM3H,
      @JsonSerialize(using = Decimals.One.class) double maxFlowM3H,
      @JsonSerialize(using = Decimals.One.class) double volumeM3,
      @JsonSerialize(using = Decimals.One.class) double wantedVolumeM3,
      @JsonSerialize(using = Decimals.One.class) Double availableM3,
      @JsonProperty("short") boolean shortOfWater,
      List<String> served,
      List<String> part,
      List<String> without) {
    public Water {
      served = served == null ? List.of() : List.copyOf(served);
      part = part == null ? List.of() : List.copyOf(part);
      without = without == null ? List.of() : List.copyOf(without);
    }
  }

  /**
   * One rule that fired, with the values it saw.
   *
   * @param values by placeholder name; numbers metric, times local, moments as objects
   */
  public record Rule(
      int seq,
      String id,
      String kind,
      String explanation,
      JsonNode values) {
    @JsonIgnore
    public boolean isCaution() {
      return "caution".equals(kind);
    }

    /** The water source a farm-wide rule is about, from its {@code ...sourceId} value. */
    public Optional<String> sourceId() {
      if (values == null) {
        return Optional.empty();
      }
      for (var it = values.properties().iterator(); it.hasNext();) {
        var e = it.next();
        if ((e.getKey().equals("sourceId") || e.getKey().endsWith(".sourceId"))
            && e.getValue().isTextual()) {
          return Optional.of(e.getValue().asText());
        }
      }
      return Optional.empty();
    }
  }

  /**
   * One moment of the night at a glance, in time order.
   *
   * @param event {@code not-covered}, {@code cover-crew-out}, {@code covers-on-by}, {@code alarm},
   *     {@code pump-on}, {@code sprinklers-on}, {@code sprinklers-off}, {@code pump-off},
   *     {@code covers-off}
   * @param what the entry in words, metric
   * @param block the block it concerns, or null; {@code source} the water source, or null
   * @param past it was due before the forecast starts
   * @param flowM3H for a pump going on, the most it draws until it goes off
   * @param until for {@code not-covered}, when the forecast starts
   * @param airC for an {@code alarm}, the air temperature it is set at; only blocks that sprinkle
   *     with water tonight, or near misses with sprinklers, have one
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  public record TimelineEntry(
      OffsetDateTime at,
      String event,
      String what,
      String block,
      String source,
      boolean past,
      @JsonSerialize(using = Decimals.One.class) Double flowM3H,
      OffsetDateTime until,
      @JsonSerialize(using = Decimals.Two.class) Double airC) {
    TimelineEntry withWhat(String words) {
      return new TimelineEntry(at, event, words, block, source, past, flowM3H, until, airC);
    }
  }

  /**
   * One forecast step at a block: air, dry and wetted bud, wet bulb, 2 m wind, the forecast's
   * wind at 10 m and the sprinkling need.
   *
   * @param requiredRateMmH null where the sprinkler water balance cannot give the need
   */
  public record Step(
      OffsetDateTime at,
      int forecastLine,
      @JsonSerialize(using = Decimals.Two.class) double airC,
      @JsonSerialize(using = Decimals.Two.class) double budC,
      @JsonSerialize(using = Decimals.Two.class) double wetBudC,
      @JsonSerialize(using = Decimals.Two.class) double wetBulbC,
      @JsonSerialize(using = Decimals.Two.class) double windMs,
      @JsonSerialize(using = Decimals.Two.class) Double wind10mMs,
      @JsonSerialize(using = Decimals.Two.class) Double requiredRateMmH) {}
}
