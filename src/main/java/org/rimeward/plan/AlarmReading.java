package org.rimeward.plan;

import java.time.Instant;

/**
 * The readings a manager sets a thermometer alarm by: sprinkling starts when the air falls to
 * {@code startAirC} (wet bulb {@code startWetBulbC}) at the dew point forecast for
 * {@code referenceAt}; the alarm is {@code alarmAirC}.
 *
 * @param alarmAt when the forecast air first reaches the alarm; null if it never does
 */
public record AlarmReading(double startAirC, double startWetBulbC, double alarmAirC,
    Instant alarmAt, Instant referenceAt) {}
