package org.rimeward.audit;

import java.io.PrintWriter;
import java.util.Locale;
import org.rimeward.cli.Main;

/**
 * A separate program for the concurrency test: {@code VARIETY T10BASE PROFILES DBFILE STAGE...}
 * runs {@code rimeward profile set CROP/VARIETY --stage S --t10 ...} once per stage, as a user
 * would from a shell, one after the other in this one JVM. It prints the exit code of each.
 */
public final class ProfileSetLoopChild {
  private ProfileSetLoopChild() {}

  public static void main(String[] args) {
    PrintWriter out = new PrintWriter(System.out, true);
    PrintWriter err = new PrintWriter(System.err, true);
    double base = Double.parseDouble(args[1]);
    for (int i = 4; i < args.length; i++) {
      // A T90 well below the T10, so each value is valid whatever the stage's table says.
      String t10 = String.format(Locale.ROOT, "%.1fC", base - (i - 4) * 0.1);
      String t90 = String.format(Locale.ROOT, "%.1fC", base - (i - 4) * 0.1 - 3.0);
      int code = Main.execute(out, err, "profile", "set", "apple/" + args[0], "--stage", args[i],
          "--t10", t10, "--t90", t90, "--note", "concurrency test", "--by", args[0], "--crop-profiles", args[2],
          "--audit", args[3]);
      out.println("exit " + code);
    }
  }
}
