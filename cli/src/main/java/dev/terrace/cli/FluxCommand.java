package dev.terrace.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.terrace.core.flux.AtomFlux;
import dev.terrace.core.flux.BeamFlux;
import dev.terrace.core.flux.BeamReading;
import dev.terrace.core.flux.FluxRatio;
import dev.terrace.core.flux.GrowthRate;
import dev.terrace.core.flux.IonGauge;
import dev.terrace.core.flux.RheedCalibration;
import dev.terrace.core.flux.Species;
import dev.terrace.core.material.Compound;
import dev.terrace.core.material.Materials;
import dev.terrace.core.units.Unit;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Quantity;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.function.Supplier;

/**
 * {@code terrace flux}: beam-flux arithmetic for the grower at the machine. Two subcommands:
 * {@code ratio} turns the beam-equivalent pressures of a group-V and a group-III beam into a
 * V/III flux ratio (with rough absolute fluxes), and {@code rheed} turns a RHEED oscillation
 * period into a growth rate.
 *
 * @since 0.1
 */
@Command(name = "flux", mixinStandardHelpOptions = true,
        description = "Beam-flux arithmetic: V/III ratio from beam-equivalent pressures, growth rate from RHEED oscillations.",
        subcommands = {FluxCommand.Ratio.class, FluxCommand.Rheed.class})
public final class FluxCommand implements Callable<Integer> {

    /** The uncertainty note printed with every BEP-derived result. */
    static final String UNCERTAINTY_NOTE = "about ±30 % unless your gauge is calibrated for these species";

    /** Output formats. */
    enum Format {
        /** Aligned text for a terminal. */
        table,
        /** One JSON object. */
        json
    }

    @Spec
    private CommandSpec spec;

    /**
     * Runs when no subcommand is given: a usage error.
     *
     * @return never returns normally
     */
    @Override
    public Integer call() {
        throw new CommandLine.ParameterException(spec.commandLine(),
                "choose a subcommand: 'ratio' (V/III ratio from beam-equivalent pressures) or 'rheed' (growth rate from a RHEED period)");
    }

    /** {@code terrace flux ratio}: V/III flux ratio from two beam-equivalent pressures. */
    @Command(name = "ratio", mixinStandardHelpOptions = true,
            description = "V/III flux ratio from the beam-equivalent pressures (BEP) of a group-V and a group-III beam, "
                    + "with rough absolute fluxes. The ion gauge's sensitivity to each species follows a rule linear in "
                    + "its electrons per molecule (eta/eta_N2 = 0.6 Z/14 + 0.4); the result is about ±30 %% unless your gauge is calibrated "
                    + "for these species.")
    static final class Ratio implements Callable<Integer> {

        @Spec
        private CommandSpec spec;

        @Option(names = "--group-v", required = true, paramLabel = "SPECIES",
                description = "Group-V species: As, As2, As4, Sb, Sb2, Sb4, P2 or P4 (case-sensitive).")
        private String groupV;

        @Option(names = "--bep-v", required = true, paramLabel = "P", description = "Group-V BEP, background subtracted.")
        private double bepV;

        @Option(names = "--group-iii", required = true, paramLabel = "SPECIES", description = "Group-III species: Ga, In or Al.")
        private String groupIii;

        @Option(names = "--bep-iii", required = true, paramLabel = "P", description = "Group-III BEP, background subtracted.")
        private double bepIii;

        @Option(names = "--unit", defaultValue = "Torr", paramLabel = "UNIT",
                description = "Pressure unit of both BEPs: Torr, mbar or Pa (default: ${DEFAULT-VALUE}).")
        private String unit;

        @Option(names = "--t-v", paramLabel = "K",
                description = "Temperature of the group-V source in K (cracker zone for cracked species); default per species.")
        private Double tV;

        @Option(names = "--t-iii", paramLabel = "K", description = "Temperature of the group-III cell in K; default per species.")
        private Double tIii;

        @Option(names = "--material", paramLabel = "COMPOUND",
                description = "Surface for per-site arrival rates, e.g. GaAs or In0.2Ga0.8As (default: the III-V pair, when tabulated).")
        private String material;

        @Option(names = "--format", defaultValue = "table", paramLabel = "FORMAT",
                description = "Output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
        private Format format;

        @Override
        public Integer call() throws JsonProcessingException {
            Species v = species(spec, groupV, "--group-v");
            Species iii = species(spec, groupIii, "--group-iii");
            if (!v.isGroupV()) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "--group-v: " + v + " is a group-III species; give one of As, As2, As4, Sb, Sb2, Sb4, P2, P4");
            }
            if (iii.isGroupV()) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "--group-iii: " + iii + " is a group-V species; give one of Ga, In, Al");
            }
            Unit u = Units.forQuantity(unit, Quantity.PRESSURE).orElseThrow(() -> new CommandLine.ParameterException(
                    spec.commandLine(), "--unit: unknown pressure unit '" + unit + "'; valid units: "
                    + String.join(", ", Units.symbolsOf(Quantity.PRESSURE))));
            BeamReading rv = reading(v, gauged(spec, positive(spec, bepV, "--bep-v", "pressure"), u, "--bep-v"), u, tV,
                    "--t-v");
            BeamReading riii = reading(iii, gauged(spec, positive(spec, bepIii, "--bep-iii", "pressure"), u, "--bep-iii"),
                    u, tIii, "--t-iii");
            Optional<Compound> surface = surface(v, iii);

            FluxRatio ratio;
            AtomFlux fv;
            AtomFlux fiii;
            try {
                ratio = BeamFlux.vToIii(rv, riii);
                fv = BeamFlux.absolute(rv);
                fiii = BeamFlux.absolute(riii);
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "cannot use these readings: " + e.getMessage(), e);
            }
            PrintWriter out = spec.commandLine().getOut();
            if (format == Format.json) {
                ObjectNode root = MAPPER.createObjectNode();
                root.put("formula", ratio.formula());
                root.put("sensitivityRule", IonGauge.SUMMERS_FORMULA);
                root.set("groupV", beamJson(rv, bepV, u));
                root.set("groupIII", beamJson(riii, bepIii, u));
                root.put("moleculeRatio", ratio.moleculeRatio());
                root.put("atomRatio", ratio.atomRatio());
                root.put("relativeUncertainty", ratio.relativeUncertainty());
                root.put("note", UNCERTAINTY_NOTE);
                ObjectNode abs = root.putObject("absolute");
                abs.put("formula", fv.formula());
                abs.put("uncertaintyFactor", fv.uncertaintyFactor());
                abs.put("groupVAtomsPerCm2PerS", fv.atomsPerCm2PerS());
                abs.put("groupIIIAtomsPerCm2PerS", fiii.atomsPerCm2PerS());
                surface.ifPresent(c -> {
                    abs.put("material", c.name());
                    abs.put("groupVAtomsPerSitePerS", fv.perSite(c));
                    abs.put("groupIIIAtomsPerSitePerS", fiii.perSite(c));
                });
                out.println(MAPPER.writeValueAsString(root));
            } else {
                out.println("V/III flux ratio from beam-equivalent pressures");
                out.println("  formula: " + ratio.formula());
                out.println("  gauge:   " + IonGauge.SUMMERS_FORMULA);
                out.println(beamLine("group V  ", rv, bepV, u));
                out.println(beamLine("group III", riii, bepIii, u));
                out.println(fmt("  molecule flux ratio J(%s)/J(%s) = %.3f", v, iii, ratio.moleculeRatio()));
                out.println(fmt("  V/III atom ratio = %.2f  (%.2f to %.2f; %s)", ratio.atomRatio(),
                        ratio.atomRatioLow(), ratio.atomRatioHigh(), UNCERTAINTY_NOTE));
                out.println("Rough absolute fluxes (within about a factor of " + fmt("%.0f", fv.uncertaintyFactor())
                        + "; gauge geometry and calibration dominate)");
                out.println("  formula: " + fv.formula());
                out.println(fmt("  %-4s %.3e %s atoms cm^-2 s^-1", v, fv.atomsPerCm2PerS(), v.element()));
                out.println(fmt("  %-4s %.3e %s atoms cm^-2 s^-1", iii, fiii.atomsPerCm2PerS(), iii.element()));
                surface.ifPresent(c -> {
                    out.println(fmt("  on %s(001), %.4e sites cm^-2: %.2f %s and %.2f %s atoms per site per s",
                            c.name(), c.sitesPerCm2(), fv.perSite(c), v.element(), fiii.perSite(c), iii.element()));
                    out.println("  (the group-III figure is the growth rate in ML/s it would give if every atom stuck)");
                });
            }
            out.flush();
            return 0;
        }

        private BeamReading reading(Species s, double bep, Unit u, Double temperatureK, String option) {
            double pa = u.toCanonical(bep, 0);
            Double t = temperatureK == null ? null : positive(spec, temperatureK, option, "temperature in K");
            try {
                return t == null ? BeamReading.of(s, pa) : BeamReading.of(s, pa, t);
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage(), e);
            }
        }

        private Optional<Compound> surface(Species v, Species iii) {
            if (material != null) {
                return Optional.of(compound(spec, material));
            }
            return Materials.compound(iii.element() + v.element());
        }

        private static ObjectNode beamJson(BeamReading r, double bep, Unit u) {
            ObjectNode n = MAPPER.createObjectNode();
            n.put("species", r.species().symbol());
            n.put("bep", bep);
            n.put("unit", u.symbol());
            n.put("bepPa", r.bepPa());
            n.put("sourceTemperatureK", r.sourceTemperatureK());
            n.put("temperatureDefaulted", r.temperatureDefaulted());
            n.put("relativeSensitivity", r.sensitivity());
            return n;
        }

        private static String beamLine(String label, BeamReading r, double bep, Unit u) {
            return fmt("  %s %-4s BEP %.3e %s, T %.0f K%s, eta/eta_N2 %.3f", label, r.species(), bep, u.symbol(),
                    r.sourceTemperatureK(), r.temperatureDefaulted() ? " (default)" : "", r.sensitivity());
        }
    }

    /** {@code terrace flux rheed}: growth rate from a RHEED oscillation period. */
    @Command(name = "rheed", mixinStandardHelpOptions = true,
            description = "Growth rate from RHEED intensity oscillations: one period is one (001) monolayer (a/2) "
                    + "during layer-by-layer growth. Give one period, or a count of periods over a time span.")
    static final class Rheed implements Callable<Integer> {

        @Spec
        private CommandSpec spec;

        @Option(names = "--period", paramLabel = "S", description = "Oscillation period in s.")
        private Double period;

        @Option(names = "--periods", paramLabel = "N", description = "Number of whole periods counted over --span.")
        private Integer periods;

        @Option(names = "--span", paramLabel = "S", description = "Time span in s covering --periods periods.")
        private Double span;

        @Option(names = "--material", defaultValue = "GaAs", paramLabel = "COMPOUND",
                description = "Film being grown, e.g. GaAs, InP or Al0.3Ga0.7As (default: ${DEFAULT-VALUE}).")
        private String material;

        @Option(names = "--format", defaultValue = "table", paramLabel = "FORMAT",
                description = "Output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
        private Format format;

        @Override
        public Integer call() throws JsonProcessingException {
            Compound c = compound(spec, material);
            GrowthRate g;
            String input;
            if (period != null) {
                if (periods != null || span != null) {
                    throw new CommandLine.ParameterException(spec.commandLine(),
                            "give either --period or --periods with --span, not both");
                }
                g = rate(spec, () -> RheedCalibration.fromPeriod(positive(spec, period, "--period", "period in s"), c));
                input = fmt("period %.4g s", period);
            } else if (periods != null && span != null) {
                if (periods < 1) {
                    throw new CommandLine.ParameterException(spec.commandLine(),
                            "--periods must be a whole number of at least 1, got " + periods);
                }
                double each = positive(spec, span, "--span", "time span in s") / periods;
                if (each < OptionRanges.MIN_RHEED_PERIOD_S || each > OptionRanges.MAX_RHEED_PERIOD_S) {
                    throw new CommandLine.ParameterException(spec.commandLine(), fmt("--span / --periods must be a"
                            + " period from %s to %s s, found %.4g s (%s s over %d periods)",
                            dev.terrace.cli.Format.num(OptionRanges.MIN_RHEED_PERIOD_S),
                            dev.terrace.cli.Format.num(OptionRanges.MAX_RHEED_PERIOD_S), each,
                            dev.terrace.cli.Format.num(span), periods));
                }
                g = rate(spec, () -> RheedCalibration.fromPeriods(periods, span, c));
                input = fmt("%d periods in %.4g s (period %.4g s)", periods, span, span / periods);
            } else {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "give --period S, or --periods N together with --span S");
            }
            PrintWriter out = spec.commandLine().getOut();
            if (format == Format.json) {
                ObjectNode root = MAPPER.createObjectNode();
                root.put("formula", RheedCalibration.FORMULA);
                root.put("material", c.name());
                root.put("latticeConstantAngstrom", c.a300());
                root.put("periodS", 1.0 / g.mlPerS());
                root.put("mlPerS", g.mlPerS());
                root.put("nmPerS", g.nmPerS());
                root.put("umPerH", g.umPerH());
                root.put("atomsPerCm2PerS", g.atomsPerCm2PerS());
                out.println(MAPPER.writeValueAsString(root));
            } else {
                out.println("Growth rate from RHEED oscillations on " + c.name() + "(001)");
                out.println("  formula: " + RheedCalibration.FORMULA);
                out.println(fmt("  input:   %s; a = %.5f angstrom (300 K), a/2 = %.5f nm", input, c.a300(),
                        c.monolayerHeightNm()));
                out.println(fmt("  %.4f ML/s = %.4f nm/s = %.4f um/h", g.mlPerS(), g.nmPerS(), g.umPerH()));
                out.println(fmt("  %.4e atoms cm^-2 s^-1 of each sublattice (the group-III flux that sticks)",
                        g.atomsPerCm2PerS()));
                out.println("  valid for layer-by-layer growth; in step flow the oscillations fade and give no rate");
            }
            out.flush();
            return 0;
        }
    }

    private static GrowthRate rate(CommandSpec spec, Supplier<GrowthRate> computation) {
        try {
            return computation.get();
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), "cannot use this RHEED reading: " + e.getMessage(), e);
        }
    }

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private static Species species(CommandSpec spec, String text, String option) {
        try {
            return Species.parse(text);
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), option + ": " + e.getMessage(), e);
        }
    }

    private static Compound compound(CommandSpec spec, String name) {
        return Materials.compound(name).orElseThrow(() -> new CommandLine.ParameterException(spec.commandLine(),
                "--material: unknown material '" + name + "'; use one of " + String.join(", ", Materials.compoundNames())
                        + ", or a ternary such as In0.2Ga0.8As"));
    }

    /**
     * Highest beam-equivalent pressure accepted, Pa (7.5e-3 Torr): above the range a hot-cathode
     * ion gauge reads, up to about 1e-3 Torr (from memory). A larger number is most often a BEP
     * typed without its exponent or in the wrong --unit.
     */
    static final double MAX_BEP_PA = 1.0;

    /** Refuses a BEP above {@link #MAX_BEP_PA}, with the range in the user's unit. */
    private static double gauged(CommandSpec spec, double bep, Unit u, String option) {
        if (u.toCanonical(bep, 0) > MAX_BEP_PA) {
            double max = u.fromCanonical(MAX_BEP_PA, 0);
            throw new CommandLine.ParameterException(spec.commandLine(), option + " must be a number greater than 0"
                    + " and at most " + fmt("%.3g", max) + " " + u.symbol() + " (" + fmt("%.3g", MAX_BEP_PA)
                    + " Pa, above what an ion gauge reads), found " + bep + " " + u.symbol()
                    + "; check the exponent and --unit");
        }
        return bep;
    }

    private static double positive(CommandSpec spec, double value, String option, String what) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    option + ": the " + what + " must be a positive number, got " + value);
        }
        return value;
    }

    private static String fmt(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
    }
}
