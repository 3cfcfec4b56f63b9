package org.rimeward.plan;

import java.util.List;

/** Every input that shaped a plan, with its full content, for the audit trail and replays. */
public record PlanInputs(List<Input> files) {
  public PlanInputs {
    files = List.copyOf(files);
  }

  /** What an input is. */
  public enum Kind {
    FARM,
    FORECAST,
    CROP_PROFILE,
    RULE,
    /** The station's readings a re-plan during the night corrected the forecast with. */
    READINGS
  }

  /** One input: its kind, its name relative to its folder, and its bytes. */
  public record Input(Kind kind, String name, byte[] content) {
    public Input {
      content = content.clone();
    }

    @Override
    public byte[] content() {
      return content.clone();
    }
  }
}
