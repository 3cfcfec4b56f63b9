package org.rimeward.cli;

import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.Month;
import java.time.YearMonth;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.io.Text;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * Reads every date option ({@code --night}, {@code --since}, {@code --day}) as
 * {@code YYYY-MM-DD}. A date that does not exist (the 30th of February) or is written another way
 * is refused with what to write, never with the date library's own words.
 */
final class DateConverter implements ITypeConverter<LocalDate> {
  private static final Pattern ISO = Pattern.compile("(\\d{4})-(\\d{1,2})-(\\d{1,2})");

  @Override
  public LocalDate convert(String value) {
    Matcher m = ISO.matcher(value.strip());
    if (!m.matches()) {
      throw new TypeConversionException(Text.quote(value) + " is not a date; write the date"
          + " as YYYY-MM-DD, e.g. 2026-04-14");
    }
    int year = Integer.parseInt(m.group(1));
    int month = Integer.parseInt(m.group(2));
    int day = Integer.parseInt(m.group(3));
    if (month < 1 || month > 12) {
      throw new TypeConversionException(Text.quote(value) + " has no month " + month
          + "; write the date as YYYY-MM-DD, e.g. 2026-04-14");
    }
    try {
      return LocalDate.of(year, month, day);
    } catch (DateTimeException e) {
      String name = Month.of(month).name().charAt(0)
          + Month.of(month).name().substring(1).toLowerCase(Locale.ROOT);
      throw new TypeConversionException(Text.quote(value) + " does not exist: " + name + " "
          + year + " has " + YearMonth.of(year, month).lengthOfMonth() + " days; write the"
          + " evening as YYYY-MM-DD");
    }
  }
}
