package org.rimeward.water;

/**
 * What a block saves per cubic metre of the least water that protects it whole, which ranks it
 * for a short source: crop value, or, when some block on the source has no crop value, hectares
 * of buds. Kept with its basis so that words about it can give the area in the reader's units.
 *
 * @param perM3 crop value, or hectares, saved per m³
 * @param byValue true for crop value, false for hectares of buds
 */
public record Stake(double perM3, boolean byValue) {}
