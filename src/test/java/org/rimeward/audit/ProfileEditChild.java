package org.rimeward.audit;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Locale;
import java.util.Random;
import org.rimeward.crop.CropFileWriter;
import org.rimeward.crop.EditJournal;
import org.rimeward.crop.PendingChange;
import org.rimeward.crop.ProfileEditor;
import org.rimeward.units.UnitSystem;

/**
 * A separate program for the kill test: {@code DBFILE PROFILES SEED} edits apple/rome-beauty's
 * tight-cluster T10 again and again, through the audit journal, until it is killed. Its writer
 * pauses a few milliseconds before and after the rename, so a kill lands inside the windows that
 * matter (pending recorded but file not yet renamed; renamed but not yet confirmed) often enough.
 * It prints {@code ready}, then {@code pending N}, {@code renamed N}, {@code confirmed N}.
 */
public final class ProfileEditChild {
  private ProfileEditChild() {}

  private static void pause(int ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }

  public static void main(String[] args) throws Exception {
    Path db = Path.of(args[0]);
    Path profiles = Path.of(args[1]);
    Random random = new Random(Long.parseLong(args[2]));
    int[] n = {0};
    ProfileEditor editor = new ProfileEditor(profiles, Clock.systemUTC(), (target, content) -> {
      pause(random.nextInt(15));
      CropFileWriter.replace(target, content);
      System.out.println("renamed " + n[0]);
      System.out.flush();
      pause(random.nextInt(15));
    });
    try (AuditStore store = AuditStore.open(db)) {
      System.out.println("ready");
      System.out.flush();
      for (n[0] = 0; ; n[0]++) {
        TrailEditJournal trail = new TrailEditJournal(store);
        EditJournal journal = new EditJournal() {
          @Override
          public void beforeWrite(PendingChange change) {
            trail.beforeWrite(change);
            System.out.println("pending " + n[0]);
            System.out.flush();
          }

          @Override
          public void afterWrite(PendingChange change) {
            trail.afterWrite(change);
            System.out.println("confirmed " + n[0]);
            System.out.flush();
          }
        };
        String t10 = String.format(Locale.ROOT, "%.1fC", -2.0 - (n[0] % 25) * 0.1);
        editor.set("apple", "rome-beauty", "tight-cluster", t10, null, UnitSystem.METRIC,
            "kill test edit " + n[0], "tester", journal);
        if (!Files.exists(db)) {
          return;
        }
      }
    }
  }
}
