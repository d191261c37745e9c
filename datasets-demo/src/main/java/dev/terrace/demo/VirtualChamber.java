package dev.terrace.demo;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.flux.BeamFlux;
import dev.terrace.core.flux.BeamReading;
import dev.terrace.core.flux.Species;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * A made-up MBE chamber that "grows" any recipe of a campaign and reports what a grower would
 * measure. <strong>Everything it makes is invented data</strong>: it serves Terrace's demo,
 * tests and benchmarks, never as a stand-in for a lab's measurements.
 *
 * <p>The chamber reads the campaign's settings and outcomes by their {@link Role}s. A droplet
 * campaign (the material section names a deposit) gets droplet nucleation, crystallised shapes
 * and holes; a film campaign (no deposit) gets 2D islands and step flow. Its physics is the
 * {@link Truth}, deliberately different from Terrace's growth-model plugins (see there). On top
 * of the truth each "measurement" scatters lognormally, by {@link #DENSITY_SCATTER} for densities
 * and {@link #SIZE_SCATTER} for sizes, and some runs fail ({@link Truth.Mishaps}).
 *
 * <p>How the settings are read, by role (all temperatures are thermocouple readings; the surface
 * is {@link Truth#thermocoupleOffsetK()} away):
 * <ul>
 *   <li>{@code substrate_temperature}: the droplet-deposition (or film-growth) step;</li>
 *   <li>{@code crystallization_temperature}: the group-V exposure of the droplets; defaults to the
 *       substrate temperature; ramps between the two ripen the droplets and may fail;</li>
 *   <li>{@code anneal_temperature}, {@code anneal_time}: a final anneal, which widens etched holes;</li>
 *   <li>{@code coverage}, {@code deposition_rate}: the deposited amount and its rate;</li>
 *   <li>{@code group_v_flux}: the true group-V atom flux, as from a calibration; or else
 *       {@code group_v_bep}: the gauge reading, turned into a flux with
 *       {@link BeamFlux#absolute(BeamReading)} and the chamber's own gauge error. In droplet
 *       campaigns this flux also sets the surface reconstruction the droplets land on (the valve is
 *       closed only just before the metal goes down);</li>
 *   <li>{@code group_v_species}: As2, As4, ... (sticking and flux per BEP differ); defaults to
 *       the tetramer of the campaign's group-V element;</li>
 *   <li>{@code miscut_angle}: terrace width for step flow (films); {@code surfactant_coverage}:
 *       lowers the diffusion barrier.</li>
 * </ul>
 *
 * <p>Settings a campaign does not have take documented defaults ({@code DEFAULT_*} below);
 * a categorical setting without a role and numeric settings without a role are accepted and
 * ignored. Outcome columns without a role, or with a role the chamber does not model for this
 * kind of campaign, are left empty. The chamber models the morphologies dot, ring, disk and hole
 * (droplet campaigns) and the growth modes step-flow and islands (film campaigns); a declared
 * class it does not model has probability zero, and when the chamber sees a kind the campaign
 * declares no class for, the class cell stays empty and the notes say what was seen.
 *
 * <p>Determinism: the same campaign, truth and seed give the same results for the same sequence
 * of calls to {@link #run(Map, Map)}. Each run draws from its own stream split off the seed's
 * stream, so run k depends only on the seed, k and its own recipe. Instances are not thread-safe.
 *
 * @since 0.1
 */
public final class VirtualChamber {

    /**
     * Lognormal scatter of measured densities, 0.15 in natural-log units (about 15 %). Invented,
     * of the size counting statistics and sample-to-sample spread give on AFM images [practice].
     */
    public static final double DENSITY_SCATTER = 0.15;
    /**
     * Lognormal scatter of measured diameters and heights, 0.06 in natural-log units (about 6 %).
     * Invented, of the size of AFM tip convolution and size spread [practice].
     */
    public static final double SIZE_SCATTER = 0.06;
    /** Boltzmann constant in eV/K, exact from the SI 2019 definitions of k_B and e. */
    public static final double BOLTZMANN_EV_PER_K = 1.380649e-23 / 1.602176634e-19;
    /**
     * Ripening exponent: the density falls as (1 + t/&tau;)^-0.75. From memory: ripening of 3D
     * droplets by surface diffusion makes the mean radius grow as t^(1/4); at fixed volume the
     * density then falls as t^(-3/4).
     */
    public static final double RIPENING_EXPONENT = 0.75;
    /** Temperature at which {@link Truth.Nucleation#ripeningTimeS()} applies, 573.15 K. */
    public static final double RIPENING_REFERENCE_K = 573.15;
    /** Substrate ramp rate between the droplet and crystallisation steps, 0.5 K/s [practice: 10-60 K/min]. */
    public static final double RAMP_RATE_K_PER_S = 0.5;
    /** Coverage at which droplet nucleation is 63 % saturated, 0.2 ML. Invented. */
    public static final double SATURATION_COVERAGE_ML = 0.2;
    /** Surfactant coverage giving half the barrier shift, 0.25 ML. Invented. */
    public static final double SURFACTANT_HALF_ML = 0.25;
    /**
     * Atoms per nm^3 of liquid Ga, 52.65, used when the material table has no value: liquid Ga
     * density 6.095 g/cm^3 (CRC Handbook, from memory) over its molar mass.
     */
    public static final double GA_LIQUID_ATOMS_PER_NM3 = 52.65;
    /** Outer diameter of a ring over the droplet's base diameter, 1.35. Invented. */
    public static final double RING_DIAMETER_FACTOR = 1.35;
    /** Diameter of a disk over the droplet's base diameter, 2.0. Invented. */
    public static final double DISK_DIAMETER_FACTOR = 2.0;
    /** Opening of an etched hole over the base diameter of the droplet that drilled it, 0.8. Invented. */
    public static final double HOLE_DIAMETER_FACTOR = 0.8;
    /**
     * Widening of a hole's diameter during an anneal above the etching onset, 0.2 nm/s (Heyn et
     * al., Nanoscale Res. Lett. 9, 285 (2014), lateral widening during long anneals; taken here
     * as the diameter's rate).
     */
    public static final double HOLE_WIDENING_NM_PER_S = 0.2;
    /** Height of a crystallised dot over the liquid cap's height, 0.7. Invented. */
    public static final double DOT_FLATTENING = 0.7;
    /** Aspect ratio of a ring over that of a dot, 0.35. Invented. */
    public static final double RING_HEIGHT_FACTOR = 0.35;
    /** Aspect ratio of a disk over that of a dot, 0.12. Invented. */
    public static final double DISK_HEIGHT_FACTOR = 0.12;
    /** Coverage in 2D islands when a film sample is imaged, 0.3 ML. Invented. */
    public static final double FILM_ISLAND_FILLING_ML = 0.3;
    /** Density factor for a deposit below its melting point (solid islands), 0.3. Invented. */
    public static final double SOLID_DEPOSIT_DENSITY_FACTOR = 0.3;
    /** Lowest group-V flux used in the physics, 1 atom per cm^2 per s, so logarithms stay finite. */
    public static final double FLUX_FLOOR = 1.0;

    /** Default droplet-deposition temperature when a droplet campaign has none, 523.15 K (250 &deg;C). Invented. */
    public static final double DEFAULT_DROPLET_TEMPERATURE_K = 523.15;
    /** Default growth temperature when a film campaign has none, 853.15 K (580 &deg;C) [practice for GaAs]. */
    public static final double DEFAULT_FILM_TEMPERATURE_K = 853.15;
    /** Default droplet coverage, 3 ML. Invented. */
    public static final double DEFAULT_DROPLET_COVERAGE_ML = 3.0;
    /** Default film thickness, 10 ML. Invented. */
    public static final double DEFAULT_FILM_COVERAGE_ML = 10.0;
    /** Default droplet deposition rate, 0.1 ML/s. Invented. */
    public static final double DEFAULT_DROPLET_RATE_ML_PER_S = 0.1;
    /** Default film growth rate, 0.5 ML/s (about 0.5 um/h of GaAs) [practice]. */
    public static final double DEFAULT_FILM_RATE_ML_PER_S = 0.5;
    /**
     * Default group-V BEP, 1e-5 Torr = 1.333e-3 Pa [practice; Heyn et al. (2014) grew GaAs buffers
     * at 0.8 ML/s with 1e-5 Torr As].
     */
    public static final double DEFAULT_GROUP_V_BEP_PA = 1e-5 * 101325.0 / 760.0;
    /** Default anneal time, 0 s (no anneal). */
    public static final double DEFAULT_ANNEAL_TIME_S = 0.0;
    /** Default miscut, 0&deg; (nominal substrate, no steps). */
    public static final double DEFAULT_MISCUT_DEG = 0.0;
    /** Default surfactant coverage, 0 ML. */
    public static final double DEFAULT_SURFACTANT_ML = 0.0;

    /** Droplet morphology: dot. */
    static final String DOT = "dot";
    /** Droplet morphology: ring. */
    static final String RING = "ring";
    /** Droplet morphology: disk. */
    static final String DISK = "disk";
    /** Droplet morphology: hole. */
    static final String HOLE = "hole";
    /** Film growth mode: step flow. */
    static final String STEP_FLOW = "step-flow";
    /** Film growth mode: 2D islands. */
    static final String ISLANDS = "islands";

    private static final long DENSITY_SALT = 0x5DEECE66DL;
    private static final long SHAPE_SALT = 0x9E3779B97F4A7C15L;
    private static final long FILM_SALT = 0xC2B2AE3D27D4EB4FL;
    private static final int FIELD_DIMENSION = 6;

    private final Campaign campaign;
    private final Truth truth;
    private final long seed;
    private final boolean droplets;
    private final Map<Role, ParameterSpec> settings = new EnumMap<>(Role.class);
    private final SplittableRandom runStream;
    private final SmoothField densityField;
    private final SmoothField shapeField;
    private final SmoothField filmField;
    private final Species defaultSpecies;

    private VirtualChamber(Campaign campaign, Truth truth, long seed) {
        this(campaign, truth, seed, seed);
    }

    private VirtualChamber(Campaign campaign, Truth truth, long seed, long scatterSeed) {
        this.campaign = Objects.requireNonNull(campaign, "campaign");
        this.truth = Objects.requireNonNull(truth, "truth");
        this.seed = seed;
        this.droplets = campaign.surface().deposit() != null;
        for (ParameterSpec p : campaign.parameters()) {
            if (p.role() != null) {
                settings.putIfAbsent(p.role(), p);
            }
        }
        this.runStream = new SplittableRandom(scatterSeed);
        this.densityField = new SmoothField(FIELD_DIMENSION, truth.nucleation().densityRoughness(), seed ^ DENSITY_SALT);
        this.shapeField = new SmoothField(FIELD_DIMENSION, truth.shape().roughness(), seed ^ SHAPE_SALT);
        this.filmField = new SmoothField(FIELD_DIMENSION, truth.film().roughness(), seed ^ FILM_SALT);
        this.defaultSpecies = tetramerOf(campaign.surface().groupV());
    }

    /**
     * A chamber with the default invented truth.
     *
     * @param campaign the campaign whose recipes it grows; never null
     * @param seed     the seed of every random draw
     * @return the chamber; never null
     */
    public static VirtualChamber of(Campaign campaign, long seed) {
        return new VirtualChamber(campaign, Truth.defaults(), seed);
    }

    /**
     * A chamber with a given invented truth.
     *
     * @param campaign the campaign whose recipes it grows; never null
     * @param truth    the hidden physics; never null
     * @param seed     the seed of every random draw
     * @return the chamber; never null
     */
    public static VirtualChamber of(Campaign campaign, Truth truth, long seed) {
        return new VirtualChamber(campaign, truth, seed);
    }

    /**
     * The same chamber (same campaign, truth and the same smooth deviations of the truth, which
     * {@code seed} fixes) with its own stream of run-to-run scatter: repeated runs of one recipe on
     * it are further draws from the very distribution this chamber's runs come from. Use it to
     * estimate a recipe's true chance of meeting spec without disturbing this chamber's stream.
     *
     * @param scatterSeed the seed of the new scatter stream
     * @return the replica; never null. This chamber is unchanged.
     */
    public VirtualChamber replica(long scatterSeed) {
        return new VirtualChamber(campaign, truth, seed, scatterSeed);
    }

    /** @return the campaign; never null */
    public Campaign campaign() {
        return campaign;
    }

    /** @return the invented truth; never null */
    public Truth truth() {
        return truth;
    }

    /** @return the seed */
    public long seed() {
        return seed;
    }

    /**
     * Grows one planned recipe.
     *
     * @param recipe the recipe; never null
     * @return the invented result; never null
     * @throws IllegalArgumentException as {@link #run(Map, Map)}
     */
    public RunResult run(Recipe recipe) {
        return run(recipe.numbers(), recipe.categories());
    }

    /**
     * Grows one recipe and reports invented measurements.
     *
     * @param numericSettings     numeric settings by column name, in the campaign's units; missing
     *                            settings take the {@code DEFAULT_*} values; never null
     * @param categoricalSettings categorical settings by column name; never null
     * @return the result: outcomes in the campaign's units, or a failed run with its reason; never null
     * @throws IllegalArgumentException when a name is not a setting of the campaign, a value is not
     *                                  finite or not one of the choices, or a value is physically
     *                                  impossible (negative coverage, rate or pressure, surface
     *                                  temperature below 50 K)
     */
    public RunResult run(Map<String, Double> numericSettings, Map<String, String> categoricalSettings) {
        Conditions c = resolve(numericSettings, categoricalSettings);
        SplittableRandom rng = runStream.split();
        double zDensity = gaussian(rng);
        double zDiameter = gaussian(rng);
        double zHeight = gaussian(rng);
        double uClass = rng.nextDouble();
        double uFail = rng.nextDouble();
        double uCause = rng.nextDouble();
        double uNote = rng.nextDouble();

        String failure = failure(c, uFail, uCause, uNote);
        if (failure != null) {
            return RunResult.failed(failure);
        }
        return droplets ? dropletRun(c, zDensity, zDiameter, zHeight, uClass)
                : filmRun(c, zDensity, zDiameter, zHeight, uClass);
    }

    // ------------------------------------------------------------------ recipe interpretation

    /** A recipe in canonical units, with the chamber's defaults filled in. */
    private record Conditions(double dropReadK, double crystReadK, double annealReadK, double coverageMl,
                              double rateMlPerS, double groupVFlux, double stickingFlux, Species species,
                              double annealS, double miscutDeg, double surfactantMl) {
    }

    private Conditions resolve(Map<String, Double> numeric, Map<String, String> categorical) {
        Objects.requireNonNull(numeric, "numericSettings");
        Objects.requireNonNull(categorical, "categoricalSettings");
        Map<String, ParameterSpec> byName = campaign.parametersByName();
        for (Map.Entry<String, Double> e : numeric.entrySet()) {
            ParameterSpec p = byName.get(e.getKey());
            if (p == null || p.isCategorical()) {
                throw new IllegalArgumentException("'" + e.getKey() + "' is not a numeric setting of campaign "
                        + campaign.id());
            }
            if (e.getValue() == null || !Double.isFinite(e.getValue())) {
                throw new IllegalArgumentException("setting " + e.getKey() + " must be finite, got " + e.getValue());
            }
        }
        for (Map.Entry<String, String> e : categorical.entrySet()) {
            ParameterSpec p = byName.get(e.getKey());
            if (p == null || !p.isCategorical()) {
                throw new IllegalArgumentException("'" + e.getKey() + "' is not a categorical setting of campaign "
                        + campaign.id());
            }
            if (!p.choices().contains(e.getValue())) {
                throw new IllegalArgumentException("setting " + e.getKey() + " expects one of " + p.choices()
                        + ", got " + e.getValue());
            }
        }
        double dropK = value(Role.SUBSTRATE_TEMPERATURE, numeric,
                droplets ? DEFAULT_DROPLET_TEMPERATURE_K : DEFAULT_FILM_TEMPERATURE_K);
        double crystK = value(Role.CRYSTALLIZATION_TEMPERATURE, numeric, dropK);
        double annealK = value(Role.ANNEAL_TEMPERATURE, numeric, crystK);
        for (double t : new double[] {dropK, crystK, annealK}) {
            if (!(t + truth.thermocoupleOffsetK() >= 50)) {
                throw new IllegalArgumentException("surface temperature " + (t + truth.thermocoupleOffsetK())
                        + " K is below 50 K; the chamber does not model cryogenic growth");
            }
        }
        double coverage = value(Role.COVERAGE, numeric, droplets ? DEFAULT_DROPLET_COVERAGE_ML : DEFAULT_FILM_COVERAGE_ML);
        nonNegative("coverage", coverage);
        double rate = value(Role.DEPOSITION_RATE, numeric,
                droplets ? DEFAULT_DROPLET_RATE_ML_PER_S : DEFAULT_FILM_RATE_ML_PER_S);
        if (!(rate > 0)) {
            throw new IllegalArgumentException("deposition rate must be positive, got " + rate + " ML/s");
        }
        Species species = species(categorical);
        double flux;
        if (has(Role.GROUP_V_FLUX, numeric)) {
            flux = value(Role.GROUP_V_FLUX, numeric, 0);
            nonNegative("group-V flux", flux);
        } else {
            double bep = value(Role.GROUP_V_BEP, numeric, DEFAULT_GROUP_V_BEP_PA);
            nonNegative("group-V BEP", bep);
            flux = bep > 0 ? BeamFlux.absolute(BeamReading.of(species, bep)).atomsPerCm2PerS()
                    * truth.supply().gaugeFluxFactor() : 0;
        }
        flux = Math.max(flux + truth.supply().backgroundFlux(), FLUX_FLOOR);
        double sticking = species.atoms() >= 4 ? truth.supply().tetramerSticking() : truth.supply().dimerSticking();
        double anneal = value(Role.ANNEAL_TIME, numeric, DEFAULT_ANNEAL_TIME_S);
        nonNegative("anneal time", anneal);
        double miscut = Math.abs(value(Role.MISCUT_ANGLE, numeric, DEFAULT_MISCUT_DEG));
        if (!(miscut < 45)) {
            throw new IllegalArgumentException("miscut must be below 45 degrees, got " + miscut);
        }
        double surfactant = value(Role.SURFACTANT_COVERAGE, numeric, DEFAULT_SURFACTANT_ML);
        nonNegative("surfactant coverage", surfactant);
        return new Conditions(dropK, crystK, annealK, coverage, rate, flux, Math.max(flux * sticking, FLUX_FLOOR),
                species, anneal, miscut, surfactant);
    }

    private boolean has(Role role, Map<String, Double> numeric) {
        ParameterSpec p = settings.get(role);
        return p != null && !p.isCategorical() && numeric.containsKey(p.name());
    }

    private double value(Role role, Map<String, Double> numeric, double fallback) {
        if (!has(role, numeric)) {
            return fallback;
        }
        ParameterSpec p = settings.get(role);
        return p.unit().toCanonical(numeric.get(p.name()), campaign.surface().monolayerHeightNm());
    }

    private Species species(Map<String, String> categorical) {
        ParameterSpec p = settings.get(Role.GROUP_V_SPECIES);
        if (p == null || !categorical.containsKey(p.name())) {
            return defaultSpecies;
        }
        try {
            Species s = Species.parse(categorical.get(p.name()));
            return s.isGroupV() ? s : defaultSpecies;
        } catch (IllegalArgumentException e) {
            return defaultSpecies;
        }
    }

    private static Species tetramerOf(String groupV) {
        try {
            Species s = Species.parse((groupV == null ? "As" : groupV) + "4");
            return s.isGroupV() ? s : Species.As4;
        } catch (IllegalArgumentException e) {
            return Species.As4;
        }
    }

    private static void nonNegative(String what, double v) {
        if (!(v >= 0)) {
            throw new IllegalArgumentException(what + " cannot be negative, got " + v);
        }
    }

    // ------------------------------------------------------------------ the invented physics

    private double surfaceK(double readK) {
        return readK + truth.thermocoupleOffsetK();
    }

    /** ln of the island or droplet density in cm^-2, before measurement scatter. */
    private double lnDensity(Conditions c, double surfaceK, double barrierEv, double prefactor, double alpha,
                             boolean ripen) {
        Truth.Nucleation n = truth.nucleation();
        double kT = BOLTZMANN_EV_PER_K * surfaceK;
        double f24 = reconstruction(c, surfaceK);
        double surfactant = n.surfactantShiftEv() * c.surfactantMl() / (c.surfactantMl() + SURFACTANT_HALF_ML);
        double e = Math.max(barrierEv + n.reconstructionStepEv() * f24 - surfactant, 0.01);
        double lnHop = StrictMath.log(n.attemptFrequencyHz()) - e / kT;
        double lnFoverD = StrictMath.log(c.rateMlPerS()) - lnHop;
        double saturation = -StrictMath.expm1(-Math.max(c.coverageMl(), 1e-6) / SATURATION_COVERAGE_ML);
        double lnBase = StrictMath.log(prefactor * saturation) + StrictMath.log(campaign.surface().sitesPerCm2());
        double ln1 = lnBase + lnFoverD / (1 + alpha);
        double ln2 = lnBase + 2 * lnFoverD / (2 + alpha) + n.pairBindingEv() / ((2 + alpha) * kT);
        double w = logistic((surfaceK - n.criticalSizeMidK()) / n.criticalSizeWidthK());
        double ln = (1 - w) * ln1 + w * ln2;
        if (ripen) {
            double tDrop = surfaceK;
            double tCryst = surfaceK(c.crystReadK());
            double rampS = Math.abs(tCryst - tDrop) / RAMP_RATE_K_PER_S;
            double lnAge1 = StrictMath.log(c.coverageMl() / c.rateMlPerS() + 1e-9) - lnRipeningTime(tDrop);
            double lnAge2 = StrictMath.log(rampS + 1e-9) - lnRipeningTime(0.5 * (tDrop + tCryst));
            ln -= RIPENING_EXPONENT * logSumExp(0, lnAge1, lnAge2);
            double melt = campaign.surface().depositMeltingK();
            if (Double.isFinite(melt)) {
                ln += StrictMath.log(SOLID_DEPOSIT_DENSITY_FACTOR) * (1 - logistic((surfaceK - melt) / 5.0));
            }
        }
        ln += densityField.value(coordinates(c));
        double lnSites = StrictMath.log(campaign.surface().sitesPerCm2());
        return clamp(ln, 0, lnSites);
    }

    /** Fraction of the surface in the (2x4) rather than the As-rich c(4x4) reconstruction. */
    private double reconstruction(Conditions c, double surfaceK) {
        Truth.Nucleation n = truth.nucleation();
        double mid = n.reconstructionMidK()
                + n.reconstructionKPerDecade() * StrictMath.log10(c.groupVFlux() / n.reconstructionReferenceFlux());
        return logistic((surfaceK - mid) / n.reconstructionWidthK());
    }

    private double lnRipeningTime(double surfaceK) {
        Truth.Nucleation n = truth.nucleation();
        return StrictMath.log(n.ripeningTimeS())
                + n.ripeningBarrierEv() / BOLTZMANN_EV_PER_K * (1 / surfaceK - 1 / RIPENING_REFERENCE_K);
    }

    private double[] coordinates(Conditions c) {
        return new double[] {surfaceK(c.dropReadK()) / 100, surfaceK(c.crystReadK()) / 100,
                StrictMath.log10(c.groupVFlux()) - 14, StrictMath.log10(c.rateMlPerS()),
                droplets ? c.coverageMl() / 2 : StrictMath.log10(1 + c.coverageMl()),
                droplets ? StrictMath.log10(1 + c.annealS() / 60) : c.miscutDeg()};
    }

    private double contactAngleRad(double surfaceK) {
        Truth.Shape s = truth.shape();
        double deg = s.contactAngleColdDeg() + (s.contactAngleHotDeg() - s.contactAngleColdDeg())
                * logistic((surfaceK - s.contactAngleMidK()) / s.contactAngleWidthK());
        return StrictMath.toRadians(deg);
    }

    /** Volume of a spherical cap over the cube of its base radius. */
    private static double capVolumeFactor(double angleRad) {
        double cos = StrictMath.cos(angleRad);
        double sin = StrictMath.sin(angleRad);
        return StrictMath.PI / 3 * (2 - 3 * cos + cos * cos * cos) / (sin * sin * sin);
    }

    /** Height of a spherical cap over its base diameter. */
    private static double capAspect(double angleRad) {
        return (1 - StrictMath.cos(angleRad)) / (2 * StrictMath.sin(angleRad));
    }

    private RunResult dropletRun(Conditions c, double zDensity, double zDiameter, double zHeight, double uClass) {
        Surface surface = campaign.surface();
        double tDrop = surfaceK(c.dropReadK());
        double tCryst = surfaceK(c.crystReadK());
        double lnN = lnDensity(c, tDrop, truth.nucleation().barrierAsRichEv(), truth.nucleation().prefactor(), 2.5, true);
        double lnSites = StrictMath.log(surface.sitesPerCm2());
        double atomsPerNm3 = surface.liquidAtomDensityPerNm3().orElse(GA_LIQUID_ATOMS_PER_NM3);
        double lnVolume = StrictMath.log(Math.max(c.coverageMl(), 1e-6)) + lnSites - lnN - StrictMath.log(atomsPerNm3);
        double angle = contactAngleRad(tDrop);
        double lnRadius = (lnVolume - StrictMath.log(capVolumeFactor(angle))) / 3;

        // Ga reach during crystallisation: a (D_c / F_V)^(1/3), a the site spacing in nm
        Truth.Shape sh = truth.shape();
        double lnSpacingNm = StrictMath.log(1e7) - 0.5 * lnSites;
        double lnHop = StrictMath.log(truth.nucleation().attemptFrequencyHz())
                - sh.reachBarrierEv() / (BOLTZMANN_EV_PER_K * tCryst);
        double lnSupply = StrictMath.log(c.stickingFlux()) - lnSites;
        double score = clamp(lnSpacingNm + (lnHop - lnSupply) / 3 - lnRadius + shapeField.value(coordinates(c)), -50, 50);
        double below1 = logistic((sh.dotRingCut() - score) / sh.softness());
        double below2 = logistic((sh.ringDiskCut() - score) / sh.softness());
        double pHole = etchingProbability(c, tDrop);
        Map<String, Double> kinds = new LinkedHashMap<>();
        kinds.put(DOT, (1 - pHole) * below1);
        kinds.put(RING, (1 - pHole) * Math.max(below2 - below1, 0));
        kinds.put(DISK, (1 - pHole) * (1 - below2));
        kinds.put(HOLE, pHole);
        String kind = drawKind(kinds, uClass);

        double baseDiameter = 2 * StrictMath.exp(lnRadius);
        double diameter;
        double height;
        double aspect = DOT_FLATTENING * capAspect(angle);
        if (HOLE.equals(kind)) {
            double widening = HOLE_WIDENING_NM_PER_S * c.annealS()
                    * logistic((surfaceK(c.annealReadK()) - truth.etching().onsetK()) / truth.etching().widthK());
            diameter = baseDiameter * HOLE_DIAMETER_FACTOR + widening;
            height = Double.NaN;
        } else if (RING.equals(kind)) {
            diameter = baseDiameter * RING_DIAMETER_FACTOR;
            height = diameter * aspect * RING_HEIGHT_FACTOR;
        } else if (DISK.equals(kind)) {
            diameter = baseDiameter * DISK_DIAMETER_FACTOR;
            height = diameter * aspect * DISK_HEIGHT_FACTOR;
        } else {
            diameter = baseDiameter;
            height = diameter * aspect;
        }
        double density = StrictMath.exp(lnN + DENSITY_SCATTER * zDensity);
        diameter *= StrictMath.exp(SIZE_SCATTER * zDiameter);
        height *= StrictMath.exp(SIZE_SCATTER * zHeight);

        Map<String, Double> numbers = new LinkedHashMap<>();
        Map<String, String> classes = new LinkedHashMap<>();
        for (OutcomeSpec o : campaign.outcomes()) {
            if (o.role() == null) {
                continue;
            }
            switch (o.role()) {
                case ISLAND_DENSITY:
                    putNumber(numbers, o, density);
                    break;
                case ISLAND_DIAMETER:
                    putNumber(numbers, o, diameter);
                    break;
                case ISLAND_HEIGHT:
                    putNumber(numbers, o, height);
                    break;
                case MORPHOLOGY:
                    putClass(classes, o, kind);
                    break;
                default:
                    break;
            }
        }
        List<String> notes = new ArrayList<>();
        double melt = surface.depositMeltingK();
        if (Double.isFinite(melt) && tDrop < melt) {
            notes.add("deposit below its melting point: solid islands, not droplets");
        }
        String undeclared = undeclaredNote(Role.MORPHOLOGY, kind);
        if (!undeclared.isEmpty()) {
            notes.add(undeclared);
        }
        return new RunResult(true, numbers, classes, String.join("; ", notes));
    }

    private RunResult filmRun(Conditions c, double zDensity, double zDiameter, double zHeight, double uClass) {
        Surface surface = campaign.surface();
        Truth.Film f = truth.film();
        double t = surfaceK(c.dropReadK());
        double lnN = lnDensity(c, t, f.barrierEv(), f.prefactor(), 2.0, false);
        double lnSpacingNm = StrictMath.log(1e7) - 0.5 * lnN;
        double vToIii = Math.max(c.stickingFlux() / (c.rateMlPerS() * surface.sitesPerCm2()), 1e-6);
        double lnCapture = lnSpacingNm - f.vToIiiExponent() * StrictMath.log(vToIii / 10);
        double pStep;
        if (c.miscutDeg() < 1e-6) {
            pStep = 0;
        } else {
            double terraceNm = surface.monolayerHeightNm() / StrictMath.tan(StrictMath.toRadians(c.miscutDeg()));
            double q = lnCapture - StrictMath.log(terraceNm) - f.stepFlowCut() + filmField.value(coordinates(c));
            pStep = logistic(clamp(q, -50, 50) / f.softness());
        }
        Map<String, Double> kinds = new LinkedHashMap<>();
        kinds.put(STEP_FLOW, pStep);
        kinds.put(ISLANDS, 1 - pStep);
        String kind = drawKind(kinds, uClass);
        boolean islands = ISLANDS.equals(kind);
        double density = StrictMath.exp(lnN + DENSITY_SCATTER * zDensity);
        double diameter = 2 * StrictMath.sqrt(FILM_ISLAND_FILLING_ML / (StrictMath.PI * StrictMath.exp(lnN))) * 1e7
                * StrictMath.exp(SIZE_SCATTER * zDiameter);
        double height = surface.monolayerHeightNm() * StrictMath.exp(SIZE_SCATTER * zHeight);

        Map<String, Double> numbers = new LinkedHashMap<>();
        Map<String, String> classes = new LinkedHashMap<>();
        for (OutcomeSpec o : campaign.outcomes()) {
            if (o.role() == null) {
                continue;
            }
            switch (o.role()) {
                case ISLAND_DENSITY:
                    if (islands) {
                        putNumber(numbers, o, density);
                    }
                    break;
                case ISLAND_DIAMETER:
                    if (islands) {
                        putNumber(numbers, o, diameter);
                    }
                    break;
                case ISLAND_HEIGHT:
                    if (islands) {
                        putNumber(numbers, o, height);
                    }
                    break;
                case GROWTH_MODE:
                    putClass(classes, o, kind);
                    break;
                default:
                    break;
            }
        }
        List<String> notes = new ArrayList<>();
        if (!islands) {
            notes.add("step flow: no islands to count");
        }
        String undeclared = undeclaredNote(Role.GROWTH_MODE, kind);
        if (!undeclared.isEmpty()) {
            notes.add(undeclared);
        }
        return new RunResult(true, numbers, classes, String.join("; ", notes));
    }

    private double etchingProbability(Conditions c, double surfaceK) {
        Truth.Etching e = truth.etching();
        return logistic((surfaceK - e.onsetK()) / e.widthK()) * lowFlux(c);
    }

    /** Logistic in log10 flux: near 1 with almost no group-V flux, near 0 with a real beam. */
    private double lowFlux(Conditions c) {
        Truth.Etching e = truth.etching();
        return logistic(-StrictMath.log10(c.groupVFlux() / e.fluxThreshold()) / e.fluxWidthDecades());
    }

    private void putNumber(Map<String, Double> into, OutcomeSpec o, double canonical) {
        if (o.isClass() || !Double.isFinite(canonical)) {
            return;
        }
        double v = o.unit().fromCanonical(canonical, campaign.surface().monolayerHeightNm());
        if (Double.isFinite(v)) {
            into.put(o.name(), v);
        }
    }

    /** Writes the declared spelling of a kind into a class outcome; nothing when it is not declared. */
    private static void putClass(Map<String, String> into, OutcomeSpec o, String kind) {
        if (!o.isClass()) {
            return;
        }
        for (String declared : o.classes()) {
            if (kind.equals(kindOf(declared))) {
                into.put(o.name(), declared);
                return;
            }
        }
    }

    /** Draws one kind among all modelled kinds with their probabilities. */
    private static String drawKind(Map<String, Double> kinds, double u) {
        double acc = 0;
        String last = null;
        for (Map.Entry<String, Double> e : kinds.entrySet()) {
            acc += e.getValue();
            last = e.getKey();
            if (u < acc) {
                return last;
            }
        }
        return last;
    }

    /** A note when the drawn kind has no class in a class outcome of the given role, else empty. */
    private String undeclaredNote(Role role, String kind) {
        for (OutcomeSpec o : campaign.outcomes()) {
            if (o.role() == role && o.isClass()
                    && o.classes().stream().noneMatch(c -> kind.equals(kindOf(c)))) {
                return "saw " + kind + ", for which " + o.name() + " has no class";
            }
        }
        return "";
    }

    /**
     * Maps a class name as a campaign spells it to the chamber's kind, or null when the chamber
     * does not model it.
     */
    static String kindOf(String declared) {
        String n = declared.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]", "");
        switch (n) {
            case "dot": case "dots": case "qd": case "qds": case "quantumdot": case "quantumdots":
                return DOT;
            case "ring": case "rings": case "quantumring": case "quantumrings":
                return RING;
            case "disk": case "disks": case "disc": case "discs":
                return DISK;
            case "hole": case "holes": case "nanohole": case "nanoholes":
                return HOLE;
            case "stepflow":
                return STEP_FLOW;
            case "islands": case "island": case "2dislands": case "2dnucleation": case "nucleation":
                return ISLANDS;
            default:
                return null;
        }
    }

    // ------------------------------------------------------------------ failed runs

    private String failure(Conditions c, double uFail, double uCause, double uNote) {
        Truth.Mishaps m = truth.mishaps();
        double hottestSurface = surfaceK(Math.max(c.dropReadK(), c.crystReadK()));
        double hottestReading = Math.max(c.dropReadK(), Math.max(c.crystReadK(), c.annealReadK()));
        double pBase = m.baseProbability();
        double pDecomp = m.decompositionProbability()
                * logistic((hottestSurface - m.decompositionK()) / m.decompositionWidthK()) * lowFlux(c);
        double pHeater = m.heaterProbability() * logistic((hottestReading - m.heaterTroubleK()) / m.heaterWidthK());
        double pRamp = droplets && settings.containsKey(Role.CRYSTALLIZATION_TEMPERATURE)
                ? m.rampProbability() * logistic((Math.abs(c.crystReadK() - c.dropReadK()) - m.rampLimitK())
                / m.rampWidthK())
                : 0;
        double pOk = (1 - pBase) * (1 - pDecomp) * (1 - pHeater) * (1 - pRamp);
        if (!(uFail < 1 - pOk)) {
            return null;
        }
        double sum = pBase + pDecomp + pHeater + pRamp;
        double pick = uCause * sum;
        String metal = campaign.surface().deposit() != null ? campaign.surface().deposit() : "group-III";
        String groupV = campaign.surface().groupV() != null ? campaign.surface().groupV() : "group-V";
        if (pick < pDecomp) {
            return droplets
                    ? "surface decomposed: too hot with almost no " + groupV + " flux; " + metal
                    + " droplets ran off in trails, nothing to measure"
                    : "surface decomposed: too hot with almost no " + groupV + " flux; rough and pitted, not measured";
        }
        if (pick < pDecomp + pHeater) {
            return "substrate heater tripped near the top of its range; run lost";
        }
        if (pick < pDecomp + pHeater + pRamp) {
            return "heater overshot on the long ramp to the crystallisation temperature; droplets ran, sample unusable";
        }
        String[] ordinary = {
            "the " + metal + " shutter stuck half open; run aborted",
            "wafer slipped in the holder during transfer; no usable sample",
            "hazy RHEED before deposition (oxide residue); run stopped",
            "pressure burst in the growth chamber during deposition; sample discarded",
            "sample cracked while unloading",
        };
        return ordinary[Math.min((int) (uNote * ordinary.length), ordinary.length - 1)];
    }

    // ------------------------------------------------------------------ description

    /**
     * The truth in plain words, for the demo output. It is labelled as invented.
     *
     * @return several lines of text, each ending in a line feed; never null
     */
    public String truthDescription() {
        Truth.Nucleation n = truth.nucleation();
        Truth.Shape s = truth.shape();
        Truth.Etching e = truth.etching();
        Truth.Mishaps m = truth.mishaps();
        StringBuilder sb = new StringBuilder();
        sb.append("INVENTED ground truth of Terrace's virtual chamber (seed ").append(seed)
                .append("); made up for the demo, not measured in any lab:\n");
        line(sb, "the thermocouple reads %s K off: surface temperature = reading %+.0f K",
                fmt(Math.abs(truth.thermocoupleOffsetK())), truth.thermocoupleOffsetK());
        line(sb, "the gauge misreads the group-V flux: true flux = %s x the BEP estimate; tetramers stick with %s,"
                + " dimers with %s", fmt(truth.supply().gaugeFluxFactor()), fmt(truth.supply().tetramerSticking()),
                fmt(truth.supply().dimerSticking()));
        if (droplets) {
            line(sb, "droplets nucleate by rate-equation scaling with prefactor %s, hop rate %s Hz x exp(-E/kT)",
                    fmt(n.prefactor()), fmt(n.attemptFrequencyHz()));
        } else {
            line(sb, "2D islands nucleate by rate-equation scaling with prefactor %s, hop rate %s Hz x exp(-E/kT),"
                    + " E = %s eV under the group-V beam", fmt(truth.film().prefactor()), fmt(n.attemptFrequencyHz()),
                    fmt(truth.film().barrierEv()));
        }
        line(sb, "the surface changes from As-rich c(4x4) to (2x4) near %s degC (surface) at a flux of %s cm^-2 s^-1,"
                + " %s K higher per decade more flux; on (2x4) the barrier is %s eV higher%s",
                fmt(n.reconstructionMidK() - 273.15), fmt(n.reconstructionReferenceFlux()),
                fmt(n.reconstructionKPerDecade()), fmt(n.reconstructionStepEv()),
                droplets ? " (" + fmt(n.barrierAsRichEv()) + " eV on c(4x4))" : "");
        line(sb, "the critical nucleus is 1 atom below about %s degC and 2 atoms above (pair binding %s eV)",
                fmt(n.criticalSizeMidK() - 273.15), fmt(n.pairBindingEv()));
        if (droplets) {
            line(sb, "droplets ripen during deposition and ramps: density x (1 + t/tau)^-%s, tau = %s s at 300 degC,"
                    + " activation %s eV", fmt(RIPENING_EXPONENT), fmt(n.ripeningTimeS()), fmt(n.ripeningBarrierEv()));
            line(sb, "droplets are spherical caps with a contact angle of %s deg when cold rising to %s deg when hot"
                    + " (halfway at %s degC)", fmt(s.contactAngleColdDeg()), fmt(s.contactAngleHotDeg()),
                    fmt(s.contactAngleMidK() - 273.15));
            line(sb, "shape: Ga reach a*(D/F_V)^(1/3) (barrier %s eV) against the droplet radius; dot below %s,"
                    + " ring between, disk above %s in ln(reach/radius), plus a smooth random part of %s",
                    fmt(s.reachBarrierEv()), fmt(s.dotRingCut()), fmt(s.ringDiskCut()), fmt(s.roughness()));
            line(sb, "holes (local droplet etching) above about %s degC surface when the group-V flux is below about"
                    + " %s cm^-2 s^-1", fmt(e.onsetK() - 273.15), fmt(e.fluxThreshold()));
        } else {
            line(sb, "step flow when the capture length N^-1/2 (shortened by the V/III ratio to the power -%s)"
                    + " beats the terrace width by a factor %s; a nominal substrate always gives islands",
                    fmt(truth.film().vToIiiExponent()), fmt(StrictMath.exp(truth.film().stepFlowCut())));
        }
        line(sb, "measurements scatter by %s %% (densities) and %s %% (sizes); %s %% of runs fail at random,"
                + " more when very hot without group-V flux, near %s degC on the heater, or on ramps over %s K",
                fmt(100 * DENSITY_SCATTER), fmt(100 * SIZE_SCATTER), fmt(100 * m.baseProbability()),
                fmt(m.heaterTroubleK() - 273.15), fmt(m.rampLimitK()));
        return sb.toString();
    }

    private static void line(StringBuilder sb, String format, Object... args) {
        sb.append("  - ").append(String.format(Locale.ROOT, format, args)).append('\n');
    }

    private static String fmt(double v) {
        BigDecimal b = new BigDecimal(v).round(new MathContext(3)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a == 0 || (a >= 1e-3 && a < 1e5)) {
            return b.toPlainString();
        }
        int exponent = b.precision() - b.scale() - 1;
        return b.movePointLeft(exponent).toPlainString() + "e" + exponent;
    }

    // ------------------------------------------------------------------ helpers

    static double logistic(double x) {
        return 1 / (1 + StrictMath.exp(-x));
    }

    private static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }

    private static double logSumExp(double a, double b, double c) {
        double m = Math.max(a, Math.max(b, c));
        return m + StrictMath.log(StrictMath.exp(a - m) + StrictMath.exp(b - m) + StrictMath.exp(c - m));
    }

    /**
     * A standard normal draw by the Box-Muller transform (Box and Muller, Ann. Math. Stat. 29,
     * 610 (1958)), written out with {@link StrictMath} so it is the same on every JVM.
     *
     * @param rng the generator; never null
     * @return a standard normal number; finite
     */
    static double gaussian(SplittableRandom rng) {
        double u1 = 1 - rng.nextDouble();
        double u2 = rng.nextDouble();
        return StrictMath.sqrt(-2 * StrictMath.log(u1)) * StrictMath.cos(2 * StrictMath.PI * u2);
    }
}
