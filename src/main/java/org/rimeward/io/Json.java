package org.rimeward.io;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationContext;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.JsonSerializer;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.cfg.JsonNodeFeature;
import com.fasterxml.jackson.databind.module.SimpleModule;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.Locale;

/**
 * The one JSON mapper of Rimeward, and the conventions every JSON it writes shares: snake_case
 * keys, dates as {@code 2026-04-14}, local times with their offset to the minute
 * ({@code 2026-04-15T00:46-07:00}; seconds only where a time has them), numbers rounded half up
 * to the decimals a field declares (see {@link Decimals}), decimals read back exactly, and keys a
 * reader does not know ignored, so a newer document still reads in an older tool and back.
 */
public final class Json {
  private static final DateTimeFormatter MINUTE =
      DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mmXXX", Locale.ROOT);

  private static final ObjectMapper MAPPER = new ObjectMapper()
      .setPropertyNamingStrategy(PropertyNamingStrategies.SNAKE_CASE)
      .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
      .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
      .configure(JsonNodeFeature.STRIP_TRAILING_BIGDECIMAL_ZEROES, false)
      .registerModule(new SimpleModule("rimeward-time")
          .addSerializer(OffsetDateTime.class, new TimeWriter())
          .addDeserializer(OffsetDateTime.class, new TimeReader())
          .addSerializer(LocalDate.class, new DateWriter())
          .addDeserializer(LocalDate.class, new DateReader()));

  private Json() {}

  /** The mapper. Do not reconfigure it: every reader and writer of Rimeward shares it. */
  public static ObjectMapper mapper() {
    return MAPPER;
  }

  /** {@code value} as indented JSON with a final line break, as Rimeward prints it. */
  public static String pretty(Object value) {
    try {
      return MAPPER.writerWithDefaultPrettyPrinter().writeValueAsString(value) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write " + value.getClass().getSimpleName()
          + " as JSON", e);
    }
  }

  /** {@code value} as JSON on one line, as the audit trail stores it. */
  public static String compact(Object value) {
    try {
      return MAPPER.writeValueAsString(value);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write " + value.getClass().getSimpleName()
          + " as JSON", e);
    }
  }

  /** {@code v} rounded half up to {@code decimals}, never a negative zero. */
  public static BigDecimal round(double v, int decimals) {
    BigDecimal d = BigDecimal.valueOf(v).setScale(decimals, RoundingMode.HALF_UP);
    return d.signum() == 0 ? d.abs() : d;
  }

  /** A time to the minute as the plan shows it; seconds are kept when a time has them. */
  public static String time(OffsetDateTime t) {
    if (t == null) {
      return null;
    }
    return t.getSecond() == 0 && t.getNano() == 0 ? MINUTE.format(t)
        : DateTimeFormatter.ISO_OFFSET_DATE_TIME.format(t);
  }

  /** Fixed decimals for a number field: {@code @JsonSerialize(using = Decimals.Two.class)}. */
  public static final class Decimals {
    private Decimals() {}

    abstract static class Fixed extends JsonSerializer<Double> {
      private final int decimals;

      Fixed(int decimals) {
        this.decimals = decimals;
      }

      @Override
      public void serialize(Double v, JsonGenerator g, SerializerProvider p) throws IOException {
        if (v == null || !Double.isFinite(v)) {
          g.writeNull();
        } else {
          g.writeNumber(round(v, decimals));
        }
      }
    }

    /** One decimal: flows, volumes, kill percentages. */
    public static final class One extends Fixed {
      public One() {
        super(1);
      }
    }

    /** Two decimals: temperatures and rates. */
    public static final class Two extends Fixed {
      public Two() {
        super(2);
      }
    }
  }

  private static final class TimeWriter extends JsonSerializer<OffsetDateTime> {
    @Override
    public void serialize(OffsetDateTime t, JsonGenerator g, SerializerProvider p) throws IOException {
      g.writeString(time(t));
    }
  }

  private static final class TimeReader extends JsonDeserializer<OffsetDateTime> {
    @Override
    public OffsetDateTime deserialize(JsonParser p, DeserializationContext c) throws IOException {
      try {
        return OffsetDateTime.parse(p.getValueAsString());
      } catch (DateTimeParseException e) {
        return (OffsetDateTime) c.handleWeirdStringValue(OffsetDateTime.class, p.getValueAsString(),
            "not a time with its offset such as 2026-04-15T00:46-07:00");
      }
    }
  }

  private static final class DateWriter extends JsonSerializer<LocalDate> {
    @Override
    public void serialize(LocalDate d, JsonGenerator g, SerializerProvider p) throws IOException {
      g.writeString(d.toString());
    }
  }

  private static final class DateReader extends JsonDeserializer<LocalDate> {
    @Override
    public LocalDate deserialize(JsonParser p, DeserializationContext c) throws IOException {
      try {
        return LocalDate.parse(p.getValueAsString());
      } catch (DateTimeParseException e) {
        return (LocalDate) c.handleWeirdStringValue(LocalDate.class, p.getValueAsString(),
            "not a date such as 2026-04-14");
      }
    }
  }
}
