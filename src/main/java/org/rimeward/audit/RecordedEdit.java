package org.rimeward.audit;

import org.rimeward.crop.ProfileEdit;

/**
 * A profile edit as the trail holds it, with what became of it.
 *
 * @param state {@code written} (or {@code found-written}) when the edit reached its file;
 *     {@code pending} while its command has not confirmed it; {@code not-written},
 *     {@code found-not-written} or {@code found-changed} when it never did; {@code recorded} for an
 *     edit recorded before the trail kept file changes (written, then recorded)
 */
public record RecordedEdit(long seq, ProfileEdit edit, String state) {
  /** Whether the edit is in its crop file, as far as the trail knows. */
  public boolean applied() {
    return state.equals("written") || state.equals("found-written") || state.equals("recorded");
  }
}
