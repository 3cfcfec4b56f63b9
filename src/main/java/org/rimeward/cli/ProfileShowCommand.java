package org.rimeward.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import org.rimeward.crop.Crop;
import org.rimeward.crop.CropLibrary;
import org.rimeward.crop.EffectiveProfile;
import org.rimeward.crop.EffectiveStage;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "show",
    description = "Show a crop's or variety's critical temperatures after inheritance, with where"
        + " each value came from.")
final class ProfileShowCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();

  @Parameters(index = "0", paramLabel = "CROP[/VARIETY]", description = "e.g. apple or apple/rome-beauty")
  String target;

  @Option(names = "--json", description = "Print JSON (always metric: t10_c, t90_c).")
  boolean json;

  @Override
  public void run() {
    String[] cv = ProfileCommand.cropAndVariety(target, "CROP[/VARIETY]");
    CropLibrary lib = CropLibrary.load(folder.resolve());
    EffectiveProfile p = lib.effective(cv[0], cv[1]);
    Crop crop = lib.crop(cv[0]).orElseThrow();
    PrintWriter out = spec.commandLine().getOut();
    if (json) {
      out.println(json(p, crop));
    } else {
      text(p, crop, ProfileCommand.units(spec), out);
    }
    out.flush();
  }

  private static String json(EffectiveProfile p, Crop crop) {
    ObjectMapper m = org.rimeward.io.Json.mapper();
    ObjectNode root = m.createObjectNode();
    root.put("crop", p.crop());
    root.put("variety", p.variety());
    root.put("exposure", crop.exposure());
    ArrayNode stages = root.putArray("stages");
    for (EffectiveStage s : p.stages()) {
      ObjectNode n = stages.addObject();
      n.put("id", s.id());
      n.put("name", s.name());
      n.put("bbch", s.bbch());
      n.put("flowering", s.flowering());
      n.put("t10_c", s.t10C());
      n.put("t90_c", s.t90C());
      n.put("provenance", s.provenance().name().toLowerCase(java.util.Locale.ROOT));
      n.put("source", s.source());
    }
    return org.rimeward.io.Json.pretty(root).stripTrailing();
  }

  private static void text(EffectiveProfile p, Crop crop, UnitSystem units, PrintWriter out) {
    out.println(p.label() + ": critical bud temperatures by stage, after inheritance");
    out.println("Bud tissue temperatures for " + crop.exposure() + " of exposure"
        + (crop.referenceVariety() == null ? "" : "; base table measured on " + crop.referenceVariety())
        + ". File: " + crop.file());
    out.println();
    out.printf("%-22s %4s  %-9s  %10s  %10s  %s%n", "STAGE", "BBCH", "FLOWERING", "T10", "T90",
        "FROM");
    for (EffectiveStage s : p.stages()) {
      out.printf("%-22s %4s  %-9s  %10s  %10s  %s%n", s.id(), s.bbch(), s.flowering() ? "yes" : "no",
          ProfileCommand.temp(s.t10C(), units),
          ProfileCommand.temp(s.t90C(), units), s.provenance().name().toLowerCase(java.util.Locale.ROOT));
    }
    out.println();
    out.println("Where each value came from:");
    for (EffectiveStage s : p.stages()) {
      out.println("  " + s.id() + " (" + s.name() + "): " + s.source());
    }
    out.println();
    out.println("T10/T90: about 10%/90% of buds killed. Buds can run colder than the air on clear,"
        + " still nights; start protection above these values.");
  }
}
