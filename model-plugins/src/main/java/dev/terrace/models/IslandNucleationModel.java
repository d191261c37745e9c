package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.Validity;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Saturation density of islands or metal droplets from atomistic nucleation theory, and the droplet
 * size that follows from it.
 *
 * <p><b>Equations.</b> The density follows {@link NucleationLaw}:
 * <pre>
 *   N = eta · N0 · (F/D)^chi · exp( E_i / ((i + alpha) · k_B · T) ),   chi = i/(i + alpha)
 *   D = (nu0/4) · exp( −(E_d + shift · min(θ_s / 1 ML, 1)) / (k_B · T) )
 * </pre>
 * with {@code T} = {@link Role#SUBSTRATE_TEMPERATURE}, {@code F} = {@link Role#DEPOSITION_RATE} in ML/s,
 * {@code N0} = {@link Surface#sitesPerCm2()}, {@code θ_s} = {@link Role#SURFACTANT_COVERAGE} (0 when absent)
 * and {@code alpha = 2} for 2D islands or {@code 2.5} for 3D islands and droplets (parameter
 * {@code island_dimension}). When the surface has a deposit metal (droplet epitaxy) and the recipe sets
 * {@link Role#COVERAGE}, each droplet holds {@code θ·N0/N} atoms at the liquid's atom density
 * ({@link Surface#liquidAtomDensityPerNm3()}); the predicted {@link Role#ISLAND_DIAMETER} is the base
 * diameter of a spherical cap of that volume with the given contact angle:
 * <pre>
 *   V = (π r³/3) · (1 − cos θc)² (2 + cos θc) / sin³θc,   diameter = 2r
 * </pre>
 *
 * <p><b>Assumptions.</b> Complete condensation, saturation regime, immobile stable clusters, one kind of
 * surface site (one reconstruction), liquid droplets that do not coarsen after deposition. Surface
 * reconstruction changes Ga droplet densities by orders of magnitude (Ohtake et al., Cryst. Growth Des.,
 * 2014; year from memory), so one fitted barrier holds for one reconstruction only.
 *
 * <p><b>Validity.</b> The prediction is marked outside when the deposit metal is solid at the substrate
 * temperature (In below 156.6 °C: Tuktamyshev et al., Nanomaterials 10, 1512 (2020) see the density law
 * break there; no values are given then; Ga is taken as a supercooled liquid down to its supercooling
 * limit, with a note, see {@link ModelSupport#solidDeposit}), when {@code D/F} is below
 * {@link NucleationLaw#MIN_HOP_TO_DEPOSITION_RATIO} (values capped at one island per site), or when the
 * surfactant shift drives the barrier to zero or below. Re-evaporation at high temperature is not
 * modelled and not flagged.
 *
 * <p><b>Defaults.</b> With the defaults (3D, i = 1, E_d = 0.7 eV, eta = 0.25) the density ratio between
 * 130 °C and 200 °C (2.34) is close to the 2.45 measured for GaAs droplet-epitaxy dots (Appl. Phys. Lett.
 * 100(21) (2012), doi 10.1063/1.4721663), but the absolute density at 0.1 ML/s (about 3e12 cm^-2 at 200 °C)
 * is more than an order of magnitude above the 1.1e11 cm^-2 measured there. Fit the prefactor or the barrier to the lab's
 * densities before trusting absolute values.
 *
 * <p><b>Surfactant.</b> {@code surfactant_shift} (eV) is the change of the barrier at a full surfactant
 * layer; the change grows linearly with {@link Role#SURFACTANT_COVERAGE} up to 1 ML and stays constant
 * above (see {@link NucleationLaw}). A positive shift raises the effective barrier, lowers {@code D} and so
 * <em>raises</em> the density; a negative one lowers it. Without the role the law is unchanged.
 *
 * <p><b>Chaining.</b> The core feeds the predicted {@link Role#ISLAND_DENSITY} into later models of the
 * campaign's {@code models:} list, for example {@code droplet-crystallization}. That model also predicts
 * {@link Role#ISLAND_DIAMETER} (of the crystallised feature); when both are listed, the later one wins, so
 * the diameter reported is that of the crystallised feature, not of the liquid droplet.
 *
 * @since 0.1
 */
public final class IslandNucleationModel implements GrowthModel {

    /** The campaign-format id of this model. */
    public static final String ID = "island-nucleation";

    /** Parameter name of the island dimension (2 or 3). */
    public static final String ISLAND_DIMENSION = "island_dimension";

    /** Parameter name of the droplet contact angle. */
    public static final String CONTACT_ANGLE = "contact_angle";

    /**
     * Shared meaning of the droplet contact angle: {@code droplet-crystallization} declares the same one,
     * so a chain of both fits one angle.
     */
    public static final String MEANING_CONTACT_ANGLE = "droplet_contact_angle";

    /**
     * Default island dimension, 3: Terrace uses this plugin mainly for metal droplets (droplet epitaxy),
     * which are three-dimensional (alpha = 2.5, Venables, Surf. Sci. 299/300, 798 (1994), from memory).
     * Set 2, or let the fit choose, for 2D islands in film growth.
     */
    public static final double DEFAULT_ISLAND_DIMENSION = 3;

    /**
     * Default droplet contact angle, 90° (hemisphere): the simple limit, common practice, not a measured
     * value. Real Ga droplets on GaAs wet at smaller angles, which gives larger base radii; fit the angle
     * from measured droplet diameters or heights.
     */
    public static final double DEFAULT_CONTACT_ANGLE_DEG = 90;

    private static final List<ModelParameter> PARAMETERS;

    static {
        List<ModelParameter> p = new ArrayList<>(NucleationLaw.parameters());
        p.add(ModelParameter.discrete(ISLAND_DIMENSION, DEFAULT_ISLAND_DIMENSION, List.of(2.0, 3.0),
                "Venables, Spiller, Hanbücken, Rep. Prog. Phys. 47, 399 (1984): alpha = 2 (2D), 2.5 (3D); "
                        + "default 3 for metal droplets (Terrace convention)",
                "2 for two-dimensional islands, 3 for three-dimensional islands and droplets"));
        p.add(ModelParameter.continuous(CONTACT_ANGLE, "deg", DEFAULT_CONTACT_ANGLE_DEG, 10, 170, false,
                "hemisphere as the simple limit (common practice); no general published value used, real Ga "
                        + "droplets on GaAs wet at smaller angles; fitted from measured diameters",
                "contact angle of the liquid droplet on the substrate").withMeaning(MEANING_CONTACT_ANGLE));
        PARAMETERS = List.copyOf(p);
    }

    /** Creates the model; it is stateless. */
    public IslandNucleationModel() {
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public String description() {
        return "Saturation density of islands or metal droplets from atomistic nucleation theory "
                + "(complete condensation), with the droplet diameter that follows from the deposited amount.";
    }

    @Override
    public Set<Role> requiredInputs() {
        return Set.of(Role.SUBSTRATE_TEMPERATURE, Role.DEPOSITION_RATE);
    }

    @Override
    public Set<Role> optionalInputs() {
        return Set.of(Role.COVERAGE, Role.SURFACTANT_COVERAGE);
    }

    @Override
    public Set<Role> predictedOutcomes() {
        return Set.of(Role.ISLAND_DENSITY, Role.ISLAND_DIAMETER);
    }

    @Override
    public List<ModelParameter> parameters() {
        return PARAMETERS;
    }

    @Override
    public Prediction predict(Conditions conditions, Surface surface, ParameterValues parameters) {
        Optional<String> bad = ModelSupport.outOfBounds(PARAMETERS, parameters);
        if (bad.isPresent()) {
            return Prediction.notApplicable(bad.get());
        }
        if (conditions.value(Role.SUBSTRATE_TEMPERATURE).isEmpty()) {
            return Prediction.notApplicable("island-nucleation needs the substrate_temperature of the deposition");
        }
        if (conditions.value(Role.DEPOSITION_RATE).isEmpty()) {
            return Prediction.notApplicable("island-nucleation needs the deposition_rate");
        }
        double t = conditions.value(Role.SUBSTRATE_TEMPERATURE).getAsDouble();
        double rate = conditions.value(Role.DEPOSITION_RATE).getAsDouble();
        double surfactant = conditions.value(Role.SURFACTANT_COVERAGE).orElse(0.0);
        if (!(t > 0)) {
            return Prediction.notApplicable("substrate temperature must be above 0 K");
        }
        if (!(rate > 0)) {
            return Prediction.notApplicable("deposition rate must be positive for nucleation");
        }
        if (surfactant < 0) {
            return Prediction.notApplicable("surfactant coverage cannot be negative");
        }
        Optional<String> solid = ModelSupport.solidDeposit(surface, t, "liquid-droplet scaling");
        if (solid.isPresent()) {
            return Prediction.notApplicable(solid.get());
        }

        double alpha = Math.round(parameters.get(ISLAND_DIMENSION)) == 2 ? NucleationLaw.ALPHA_2D
                : NucleationLaw.ALPHA_3D;
        NucleationLaw law = NucleationLaw.from(parameters, alpha);
        List<String> reasons = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        ModelSupport.supercooledNote(surface, t).ifPresent(notes::add);

        if (law.rawEffectiveBarrierEv(surfactant) <= 0) {
            reasons.add("the surfactant shift brings the diffusion barrier to "
                    + ModelSupport.sig3(law.rawEffectiveBarrierEv(surfactant)) + " eV; hopping is no longer activated");
        }
        double lnHopsPerMl = law.lnHopRate(t, surfactant) - Math.log(rate);
        if (lnHopsPerMl < Math.log(NucleationLaw.MIN_HOP_TO_DEPOSITION_RATIO)) {
            reasons.add("adatoms make only about " + ModelSupport.sig3(Math.exp(lnHopsPerMl))
                    + " hops per deposited monolayer (D/F); nucleation scaling needs D/F above "
                    + ModelSupport.sig3(NucleationLaw.MIN_HOP_TO_DEPOSITION_RATIO));
        }
        double lnPerSite = law.lnDensityPerSite(rate, t, surfactant);
        if (lnPerSite > 0) {
            lnPerSite = 0;  // capped at one island per site; already flagged through D/F above
        }
        double n0 = surface.sitesPerCm2();
        double density = n0 * Math.exp(lnPerSite);

        Map<Role, Double> values = new EnumMap<>(Role.class);
        values.put(Role.ISLAND_DENSITY, density);
        surfactantNote(law, surfactant).ifPresent(notes::add);
        notes.add("mean island spacing about " + ModelSupport.sig3(ModelSupport.NM_PER_CM / Math.sqrt(density))
                + " nm");

        OptionalDiameter d = dropletDiameter(conditions, surface, density, parameters.get(CONTACT_ANGLE));
        d.value().ifPresent(v -> values.put(Role.ISLAND_DIAMETER, v));
        d.note().ifPresent(notes::add);

        Validity validity = reasons.isEmpty() ? Validity.ok() : Validity.outside(String.join("; ", reasons));
        return new Prediction(values, Map.of(), validity, notes);
    }

    /**
     * The saturation density for given conditions, without validity checks.
     *
     * @param law          the nucleation law
     * @param rateMlPerS   deposition rate in ML/s; positive
     * @param temperatureK substrate temperature in K; positive
     * @param surfactantMl surfactant pre-coverage in ML
     * @param sitesPerCm2  surface sites per ML, N0, in cm^-2
     * @return the density in cm^-2, capped at {@code sitesPerCm2}
     */
    public static double saturationDensity(NucleationLaw law, double rateMlPerS, double temperatureK,
                                           double surfactantMl, double sitesPerCm2) {
        double lnPerSite = Math.min(0.0, law.lnDensityPerSite(rateMlPerS, temperatureK, surfactantMl));
        return sitesPerCm2 * Math.exp(lnPerSite);
    }

    /**
     * Base diameter of a liquid droplet holding {@code θ·N0/N} atoms.
     *
     * @param coverageMl      deposited metal in ML
     * @param densityPerCm2   droplet density in cm^-2; positive
     * @param surface         the growth surface, with the liquid's atom density
     * @param contactAngleDeg contact angle in degrees
     * @return the base diameter in nm, empty when the liquid density is unknown or the coverage not positive
     */
    public static Optional<Double> dropletBaseDiameterNm(double coverageMl, double densityPerCm2, Surface surface,
                                                        double contactAngleDeg) {
        if (!(coverageMl > 0) || !(densityPerCm2 > 0) || surface.liquidAtomDensityPerNm3().isEmpty()) {
            return Optional.empty();
        }
        double atoms = coverageMl * surface.sitesPerCm2() / densityPerCm2;
        return Optional.of(2 * ModelSupport.capBaseRadiusNm(atoms, surface.liquidAtomDensityPerNm3().getAsDouble(),
                contactAngleDeg));
    }

    private static OptionalDiameter dropletDiameter(Conditions conditions, Surface surface, double density,
                                                    double contactAngleDeg) {
        if (surface.depositMetal().isEmpty() || conditions.value(Role.COVERAGE).isEmpty()) {
            return new OptionalDiameter(Optional.empty(), Optional.empty());
        }
        if (surface.liquidAtomDensityPerNm3().isEmpty()) {
            return new OptionalDiameter(Optional.empty(), Optional.of("droplet diameter not predicted: the liquid "
                    + "density of " + surface.depositMetal().get() + " is unknown"));
        }
        double coverage = conditions.value(Role.COVERAGE).getAsDouble();
        return new OptionalDiameter(dropletBaseDiameterNm(coverage, density, surface, contactAngleDeg),
                Optional.empty());
    }

    /**
     * A remark on the surfactant's effect on the diffusion barrier, when it has one.
     *
     * @param law          the nucleation law
     * @param surfactantMl surfactant pre-coverage in ML
     * @return the remark, empty when the surfactant changes nothing
     */
    static Optional<String> surfactantNote(NucleationLaw law, double surfactantMl) {
        double change = law.rawEffectiveBarrierEv(surfactantMl) - law.diffusionBarrierEv();
        if (change == 0) {
            return Optional.empty();
        }
        return Optional.of("surfactant (" + ModelSupport.sig3(surfactantMl) + " ML) changes the adatom diffusion "
                + "barrier by " + (change > 0 ? "+" : "") + ModelSupport.sig3(change) + " eV"
                + (surfactantMl >= NucleationLaw.SURFACTANT_SATURATION_ML ? " (full layer: the whole shift)" : ""));
    }

    /** A diameter and a remark, each possibly absent. */
    private record OptionalDiameter(Optional<Double> value, Optional<String> note) {
    }
}
