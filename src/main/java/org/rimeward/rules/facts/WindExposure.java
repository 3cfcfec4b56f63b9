package org.rimeward.rules.facts;

/** Derived: the block's wind band while below freezing. */
public record WindExposure(String blockId, WindLevel level, double maxWindMs) {}
