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
    List<Block> blocks,
    List<Water> water,
    List<String> cautions,
    List<Rule> farmRules) {
  public PlanDocument {
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

  /** The night at the forecast point. */
  public record Night(
      LocalDate date,
      String zone,
      OffsetDateTime sunset,
      OffsetDateTime sunrise,
      OffsetDateTime coldestAt,
      @JsonSerialize(using = Decimals.Two.class) double minAirC) {}

  /** The policy as the farm file wrote it. */
  public record Policy(
      String target,
      @JsonSerialize(using = Decimals.Two.class) double startMarginC,
      String stopRule) {}

  /**
   * One block's plan.
   *
   * @param risk {@code none}, {@code watch}, {@code damage} or {@code severe}
   * @param status {@code not-needed}, {@code protected}, {@code short-of-water}, {@code unprotected}
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
      List<Action> actions,
      List<String> cautions,
      List<Rule> rules,
      @JsonInclude(JsonInclude.Include.NON_EMPTY) List<Step> series) {
    public Block {
      actions = actions == null ? List.of() : List.copyOf(actions);
      cautions = cautions == null ? List.of() : List.copyOf(cautions);
      rules = rules == null ? List.of() : List.copyOf(rules);
      series = series == null ? List.of() : List.copyOf(series);
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
   * @param start null, like {@code stop}, when the block gets no water
   * @param designRateMmH the sprinklers' installed design rate
   * @param installedRateMmH the rate it runs at tonight: the design rate, or lower when short
   * @param flowM3H the granted draw; {@code waterM3} the granted water; {@code areaHa} protected
   * @param wantedFlowM3H the draw at the design rate over the whole block
   * @param waterGranted false when a short source leaves it dry: sprinklers off
   * @param grant {@code full}, {@code reduced-rate}, {@code sets}, {@code part-area}, {@code none}
   * @param sets the irrigation sets that run, when only some do
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
      List<String> sets) implements Action {
    public Sprinkle {
      sets = sets == null ? List.of() : List.copyOf(sets);
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

  /** One forecast step at a block: air, dry and wetted bud, wet bulb, 2 m wind. */
  public record Step(
      OffsetDateTime at,
      int forecastLine,
      @JsonSerialize(using = Decimals.Two.class) double airC,
      @JsonSerialize(using = Decimals.Two.class) double budC,
      @JsonSerialize(using = Decimals.Two.class) double wetBudC,
      @JsonSerialize(using = Decimals.Two.class) double wetBulbC,
      @JsonSerialize(using = Decimals.Two.class) double windMs) {}
}
