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
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Morphology of metal droplets after exposure to the group-V flux (droplet epitaxy): dot, ring, disk,
 * or a hole etched into the substrate.
 *
 * <p>The published interpretations (Somaschini et al., Nanoscale Res. Lett. 5, 1865 (2010); Wang et al.,
 * Chin. Phys. B 29, 046801 (2020)) describe the crystallised shape as set by how far the metal migrates out
 * of the droplet before group-V atoms arrive. This model turns that picture into a fitted classifier.
 *
 * <p><b>Equations.</b>
 * <pre>
 *   r        base radius of a spherical cap holding θ·N0/N atoms at the liquid density (contact angle θc)
 *   D_c      = (nu0/4) · a² · exp(−E_c / k_B T),  a² = 1/N0           metal diffusion, nm²/s
 *   tau      = N0 / (s · J_V)                                        time for a site to receive a group-V atom
 *   L        = sqrt(D_c · tau),   Lambda = L / r
 *   P(class ≤ k) = logistic((c_k − ln Lambda) / width),  c_dot = dot_ring_cut, c_ring = c_dot + ring_disk_gap
 *   P(hole)  = logistic((T − T_etch)/w_T) · logistic((ln J_thr − ln J_V)/w_J)
 *   P(dot), P(ring), P(disk) = (1 − P(hole)) × the ordered (cumulative-link) probabilities
 *   r_x      base radius of a spherical cap (same contact angle) holding the crystal volume
 *            V_x = (θ·N0/N) / n_x,   n_x = 4/a³ group-III atoms per volume of the compound (zinc blende)
 *   diameter = 2 · (r_x + k · L_eff · (1 − P_ordered(dot))),   L_eff = L·S/(L + S),  S = N^(−1/2)/2
 * </pre>
 * {@code θ} = {@link Role#COVERAGE}, {@code N} = {@link Role#ISLAND_DENSITY}, {@code J_V} =
 * {@link Role#GROUP_V_FLUX} (atoms cm^-2 s^-1), {@code T} = {@link Role#CRYSTALLIZATION_TEMPERATURE}, falling
 * back to {@link Role#SUBSTRATE_TEMPERATURE}. The sticking coefficient {@code s} depends on
 * {@link Role#GROUP_V_SPECIES}: tetramers (As4, Sb4, P4) use {@code tetramer_sticking}, dimers and atoms
 * {@code dimer_sticking}. When the species is not given (or not recognised) the model assumes the molecule
 * of {@link Surface#defaultGroupVSpecies()} (As4, Sb4 or P2), the same one the core's BEP-to-flux conversion
 * assumes, and says so in a note.
 *
 * <p><b>Diameter.</b> The predicted {@link Role#ISLAND_DIAMETER} is that of the crystallised feature. A dot
 * holds the droplet's metal atoms as the compound, so its volume is the droplet volume times the ratio of
 * the cation densities of the liquid metal and of the compound (about 2.38 for Ga into GaAs, 2.05 for In into
 * InAs, 2.40 for Al into AlAs); the dot is taken as a cap of the same contact angle, so its base is
 * {@code ratio^(1/3)} times the droplet base (1.34 for Ga/GaAs). Rings and disks grow from that with the
 * migration length. The spread is capped
 * smoothly at half the mean droplet spacing {@code S}, beyond which neighbouring features merge. Both
 * {@code L_eff} and {@code 1 − P_ordered(dot)} grow with the crystallisation temperature, so at a fixed
 * group-V flux and droplet density the diameter never decreases as that temperature rises. The hole
 * factor is left out of the diameter on purpose: the opening of an etched hole is not modelled. No value
 * is given when the group-V flux is zero.
 *
 * <p><b>Chaining.</b> {@link Role#ISLAND_DENSITY} comes from a measured value in the run log, or from
 * {@code island-nucleation} listed earlier in the campaign's {@code models:} list. Both models predict
 * {@link Role#ISLAND_DIAMETER}; the later one in the list wins, so list this model after
 * {@code island-nucleation} to report the crystallised feature's diameter. The core passes an upstream
 * density on only when that prediction is valid; otherwise this model reports the missing density.
 *
 * <p><b>Assumptions.</b> Liquid droplets of one size, isotropic metal diffusion (the [110]/[1−10] anisotropy
 * reported by Somaschini et al. is averaged), group-V arrival limited by sticking, etching switched on by
 * temperature and a lack of group-V flux (Heyn et al., Nanoscale Res. Lett. 9, 285 (2014), citation from
 * memory; Zhou et al., APL (2010): the congruent-evaporation limit depends on the As flux). Mixed
 * features (holes inside rings) are not a class of their own.
 *
 * <p><b>Metals.</b> Texts name the campaign's deposit metal. The defaults of the migration barrier and the
 * etching onset are published for Ga on GaAs; for In and Al droplets no published values were found, so the
 * Ga values are carried over and each prediction says so in a note until the lab's runs fit them.
 *
 * <p><b>Validity.</b> Outside when a needed input is missing, when the deposit metal is solid at the
 * crystallisation temperature (below the melting point a droplet is taken as a supercooled liquid down to
 * the metal's supercooling limit, with a note; below that no values are given), when a droplet would hold
 * less than one atom, or when there is no group-V flux below the etching onset (nothing crystallises). The
 * crystallised diameter is not given when the compound of the deposit and the group-V element is not in the
 * material table.
 *
 * @since 0.1
 */
public final class DropletCrystallizationModel implements GrowthModel {

    /** The campaign-format id of this model. */
    public static final String ID = "droplet-crystallization";

    /** Class name: a compact dot keeping the droplet's footprint. */
    public static final String DOT = "dot";
    /** Class name: a ring (or multiple rings) around the droplet's footprint. */
    public static final String RING = "ring";
    /** Class name: a flat disk spread well beyond the droplet. */
    public static final String DISK = "disk";
    /** Class name: a hole etched into the substrate (local droplet etching). */
    public static final String HOLE = "hole";

    /** Parameter name of the metal migration barrier during crystallisation. */
    public static final String MIGRATION_BARRIER = "migration_barrier";
    /** Parameter name of the attempt frequency. */
    public static final String ATTEMPT_FREQUENCY = "attempt_frequency";
    /** Parameter name of the tetramer sticking coefficient. */
    public static final String TETRAMER_STICKING = "tetramer_sticking";
    /** Parameter name of the dimer sticking coefficient. */
    public static final String DIMER_STICKING = "dimer_sticking";
    /** Parameter name of the contact angle. */
    public static final String CONTACT_ANGLE = "contact_angle";
    /** Parameter name of the dot/ring cut point in ln Lambda. */
    public static final String DOT_RING_CUT = "dot_ring_cut";
    /** Parameter name of the distance from the dot/ring to the ring/disk cut point. */
    public static final String RING_DISK_GAP = "ring_disk_gap";
    /** Parameter name of the width of the ordered classes in ln Lambda. */
    public static final String REGIME_WIDTH = "regime_width";
    /** Parameter name of the spread factor k of the diameter. */
    public static final String SPREAD_FACTOR = "spread_factor";
    /** Parameter name of the etching onset temperature. */
    public static final String ETCHING_ONSET_TEMPERATURE = "etching_onset_temperature";
    /** Parameter name of the width of the etching onset. */
    public static final String ETCHING_ONSET_WIDTH = "etching_onset_width";
    /** Parameter name of the group-V flux below which droplets etch. */
    public static final String ETCHING_FLUX_THRESHOLD = "etching_flux_threshold";
    /** Parameter name of the width of the flux threshold in ln J. */
    public static final String ETCHING_FLUX_WIDTH = "etching_flux_width";

    /**
     * Default metal migration barrier, 0.7 eV: Ga diffusion activation energy on GaAs(001) from ring size
     * against crystallisation temperature, 0.7 ± 0.1 eV, Wang et al., Chin. Phys. B 29, 046801 (2020). No
     * published value was found for In or Al droplets; the Ga value is carried over for them (flagged in a note).
     */
    public static final double DEFAULT_MIGRATION_BARRIER_EV = 0.7;

    /** Default total attempt frequency, 1e13 Hz (common practice), same convention as {@link NucleationLaw}. */
    public static final double DEFAULT_ATTEMPT_FREQUENCY_HZ = 1e13;

    /**
     * Default sticking of tetramers (As4, Sb4, P4), 0.5: pairwise dissociation of As4 on Ga sites, Foxon and
     * Joyce, Surf. Sci. 50, 434 (1975). Near-unity As4 sticking before droplets nucleate was reported by
     * Webb, Liu, Eckstein, APL (1992); hence a parameter.
     */
    public static final double DEFAULT_TETRAMER_STICKING = 0.5;

    /** Default sticking of dimers (As2, Sb2, P2), 1: Foxon and Joyce, Surf. Sci. 64, 293 (1977) (from memory). */
    public static final double DEFAULT_DIMER_STICKING = 1.0;

    /** Default contact angle, 90° (hemisphere): the simple limit, common practice, not a measured value. */
    public static final double DEFAULT_CONTACT_ANGLE_DEG = 90;

    /**
     * Default dot/ring cut point in ln Lambda, 1.5: no published value. Chosen so that the defaults give
     * dots at 150 °C under 1e-4 Torr As4 (compact dots at low T and high As flux: Watanabe, Koguchi,
     * Gotoh, JJAP 39, L79 (2000), from memory) and rings at 300 °C under 1e-6 Torr for droplets of 15-50 nm
     * radius (rings at intermediate T and lower flux: Mano et al., Nano Lett. 5, 425 (2005)). Fitted from
     * the lab's runs.
     */
    public static final double DEFAULT_DOT_RING_CUT = 1.5;

    /**
     * Default gap between the dot/ring and ring/disk cut points, 3.0 (so the ring/disk cut is at
     * ln Lambda = 4.5, Lambda = 90): no published value; puts disks at 400 °C under 1e-7 Torr for 15 nm
     * droplets, above the ring range of the same sources. Fitted from the lab's runs.
     */
    public static final double DEFAULT_RING_DISK_GAP = 3.0;

    /**
     * Default width of the ordered classes in ln Lambda, 0.5: no published value; a factor of e^0.5 = 1.65
     * in Lambda moves a class probability from 0.5 to 0.73. Fitted from the lab's runs.
     */
    public static final double DEFAULT_REGIME_WIDTH = 0.5;

    /**
     * Default spread factor k, 0.5: no published value. Rings and disks grow with the Ga migration length
     * (Somaschini et al. 2010; Wang et al. 2020); k scales that growth and is fitted from the lab's
     * measured ring and disk diameters.
     */
    public static final double DEFAULT_SPREAD_FACTOR = 0.5;

    /**
     * Default etching onset, 843.15 K (570 °C): Ga local droplet etching of GaAs shown at 570-620 °C,
     * Heyn et al., Nanoscale Res. Lett. 9, 285 (2014) (citation from memory; values read in a copy of the text).
     * Carried over for In and Al droplets (flagged in a note): no published onset for them was verified.
     */
    public static final double DEFAULT_ETCHING_ONSET_K = 843.15;

    /**
     * Default width of the etching onset, 15 K: no published value; about the uncertainty of substrate
     * temperature readings by thermocouple or pyrometer (common practice). Fitted from the lab's runs.
     */
    public static final double DEFAULT_ETCHING_ONSET_WIDTH_K = 15;

    /**
     * Default group-V atom flux below which droplets etch, 4.38e13 atoms cm^-2 s^-1: the As flux of a
     * 1e-7 Torr As4 flux-gauge reading (Heyn et al. 2014: LDE with the As reading below 1e-7 Torr). Rough
     * conversion: n = BEP/(eta·k_B·300 K) with the ion-gauge sensitivity eta = 0.6·Z/14 + 0.4 = 6.057 for As4
     * (the form closer to Summers' measured sensitivities, NASA TN D-5285 (1969)), J = n·sqrt(8 k_B T/(π m))
     * at a 600 K As4 source, four atoms per molecule. Gauges differ by ±30 % or more; fit it for the lab's gauge.
     */
    public static final double DEFAULT_ETCHING_FLUX_THRESHOLD = 4.38e13;

    /**
     * Default width of the flux threshold in ln J, 0.5: no published value; a factor of 1.65 in flux moves
     * the flux factor from 0.5 to 0.73. Fitted from the lab's runs.
     */
    public static final double DEFAULT_ETCHING_FLUX_WIDTH = 0.5;

    /**
     * Group-V flux used in place of zero when computing the migration length, 1 atom cm^-2 s^-1, so that
     * numbers stay finite with the valve closed; the diameter is not reported then.
     */
    public static final double FLUX_FLOOR = 1.0;

    /**
     * Congruent evaporation temperature of GaAs, about 898 K (625 °C), used only for a note; it depends on
     * the As flux (Zhou et al., APL (2010); Heyn et al. 2014 citing earlier work).
     */
    public static final double CONGRUENT_EVAPORATION_GAAS_K = 898.15;

    /** The deposit metal whose published values the defaults are. */
    static final String DEFAULTS_METAL = "Ga";

    private static final List<String> CLASSES = List.of(DOT, RING, DISK, HOLE);

    private static final List<ModelParameter> PARAMETERS = List.of(
            ModelParameter.continuous(MIGRATION_BARRIER, "eV", DEFAULT_MIGRATION_BARRIER_EV, 0.1, 2.0, false,
                    "Wang et al., Chin. Phys. B 29, 046801 (2020): Ga on GaAs(001), 0.7 ± 0.1 eV; "
                            + "carried over for In and Al (no published value found)",
                    "barrier E_c of metal migration out of the droplet during crystallisation"),
            ModelParameter.continuous(ATTEMPT_FREQUENCY, "Hz", DEFAULT_ATTEMPT_FREQUENCY_HZ, 1e9, 1e15, true,
                    "common practice (lattice vibration frequency)",
                    "total attempt frequency nu0; D_c = (nu0/4)·a²·exp(-E_c/kT)"),
            ModelParameter.continuous(TETRAMER_STICKING, "", DEFAULT_TETRAMER_STICKING, 0.01, 1.0, false,
                    "Foxon & Joyce, Surf. Sci. 50, 434 (1975): As4 sticking at most 0.5",
                    "sticking coefficient of As4, Sb4 or P4 molecules"),
            ModelParameter.continuous(DIMER_STICKING, "", DEFAULT_DIMER_STICKING, 0.01, 1.0, false,
                    "Foxon & Joyce, Surf. Sci. 64, 293 (1977): As2 sticking up to about 1 (from memory)",
                    "sticking coefficient of As2, Sb2 or P2 molecules"),
            ModelParameter.continuous(CONTACT_ANGLE, "deg", DEFAULT_CONTACT_ANGLE_DEG, 10, 170, false,
                    "hemisphere as the simple limit (common practice); fitted from measured diameters",
                    "contact angle of the liquid droplet").withMeaning(IslandNucleationModel.MEANING_CONTACT_ANGLE),
            ModelParameter.continuous(DOT_RING_CUT, "", DEFAULT_DOT_RING_CUT, -5, 8, false,
                    "no published value; set so defaults give dots at 150 °C/1e-4 Torr As4 and rings at "
                            + "300 °C/1e-6 Torr (Watanabe et al. 2000, from memory; Mano et al. 2005); fitted",
                    "cut point between dot and ring in ln(migration length / droplet radius)"),
            ModelParameter.continuous(RING_DISK_GAP, "", DEFAULT_RING_DISK_GAP, 0.1, 10, false,
                    "no published value; fitted from the lab's runs",
                    "distance from the dot/ring cut to the ring/disk cut in ln(migration length / radius)"),
            ModelParameter.continuous(REGIME_WIDTH, "", DEFAULT_REGIME_WIDTH, 0.05, 3, true,
                    "no published value; fitted from the lab's runs",
                    "width of the ordered dot/ring/disk transitions in ln(migration length / radius)"),
            ModelParameter.continuous(SPREAD_FACTOR, "", DEFAULT_SPREAD_FACTOR, 0, 2, false,
                    "no published value; fitted from measured ring and disk diameters",
                    "growth of the feature radius per unit of migration length"),
            ModelParameter.continuous(ETCHING_ONSET_TEMPERATURE, "K", DEFAULT_ETCHING_ONSET_K, 700, 1000, false,
                    "Heyn et al., Nanoscale Res. Lett. 9, 285 (2014) (citation from memory): Ga-LDE on GaAs at "
                            + "570-620 °C; carried over for In and Al (no published value verified)",
                    "substrate temperature above which droplets etch holes when group-V flux is low"),
            ModelParameter.continuous(ETCHING_ONSET_WIDTH, "K", DEFAULT_ETCHING_ONSET_WIDTH_K, 1, 100, false,
                    "no published value; about the uncertainty of substrate temperature readings (common practice)",
                    "width of the etching onset in temperature"),
            ModelParameter.continuous(ETCHING_FLUX_THRESHOLD, "cm^-2 s^-1", DEFAULT_ETCHING_FLUX_THRESHOLD, 1e10,
                    1e17, true,
                    "1e-7 Torr As4 flux-gauge reading (Heyn et al. 2014), converted with the ion-gauge "
                            + "electron-count sensitivity and a 600 K source (rough, ±30 %)",
                    "group-V atom flux below which droplets etch instead of crystallising"),
            ModelParameter.continuous(ETCHING_FLUX_WIDTH, "", DEFAULT_ETCHING_FLUX_WIDTH, 0.05, 3, true,
                    "no published value; fitted from the lab's runs",
                    "width of the etching flux threshold in ln(flux)"));

    /** Creates the model; it is stateless. */
    public DropletCrystallizationModel() {
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public String description() {
        return "Morphology (dot, ring, disk or hole) and feature diameter of metal droplets crystallised under "
                + "a group-V flux, from the metal migration length compared with the droplet radius.";
    }

    @Override
    public Set<Role> requiredInputs() {
        return Set.of(Role.COVERAGE, Role.ISLAND_DENSITY, Role.GROUP_V_FLUX);
    }

    @Override
    public Set<Role> optionalInputs() {
        return Set.of(Role.CRYSTALLIZATION_TEMPERATURE, Role.SUBSTRATE_TEMPERATURE, Role.GROUP_V_SPECIES);
    }

    @Override
    public Set<Role> predictedOutcomes() {
        return Set.of(Role.MORPHOLOGY, Role.ISLAND_DIAMETER);
    }

    @Override
    public List<String> classes(Role role) {
        return role == Role.MORPHOLOGY ? CLASSES : List.of();
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
        List<String> notes = new ArrayList<>();
        double t;
        if (conditions.value(Role.CRYSTALLIZATION_TEMPERATURE).isPresent()) {
            t = conditions.value(Role.CRYSTALLIZATION_TEMPERATURE).getAsDouble();
        } else if (conditions.value(Role.SUBSTRATE_TEMPERATURE).isPresent()) {
            t = conditions.value(Role.SUBSTRATE_TEMPERATURE).getAsDouble();
            notes.add("no crystallization_temperature given; the substrate temperature is used");
        } else {
            return Prediction.notApplicable("droplet-crystallization needs the crystallization_temperature "
                    + "(or the substrate_temperature)");
        }
        if (conditions.value(Role.COVERAGE).isEmpty()) {
            return Prediction.notApplicable("droplet-crystallization needs the deposited metal coverage");
        }
        if (conditions.value(Role.ISLAND_DENSITY).isEmpty()) {
            return Prediction.notApplicable("droplet-crystallization needs the droplet density: list "
                    + IslandNucleationModel.ID + " before it in the campaign's models, or measure the density");
        }
        if (conditions.value(Role.GROUP_V_FLUX).isEmpty()) {
            return Prediction.notApplicable("droplet-crystallization needs the group-V flux "
                    + "(group_v_flux, or group_v_bep with group_v_species)");
        }
        double coverage = conditions.value(Role.COVERAGE).getAsDouble();
        double density = conditions.value(Role.ISLAND_DENSITY).getAsDouble();
        double flux = conditions.value(Role.GROUP_V_FLUX).getAsDouble();
        if (!(t > 0)) {
            return Prediction.notApplicable("crystallisation temperature must be above 0 K");
        }
        if (!(coverage > 0)) {
            return Prediction.notApplicable("no metal deposited: coverage must be positive for droplets");
        }
        if (!(density > 0)) {
            return Prediction.notApplicable("droplet density must be positive");
        }
        if (flux < 0) {
            return Prediction.notApplicable("group-V flux cannot be negative");
        }
        if (surface.depositMetal().isEmpty()) {
            return Prediction.notApplicable("droplet-crystallization needs a deposit metal in the campaign's material");
        }
        if (surface.liquidAtomDensityPerNm3().isEmpty()) {
            return Prediction.notApplicable("the liquid density of " + surface.depositMetal().get()
                    + " is unknown; droplet size cannot be computed");
        }
        Optional<String> solid = ModelSupport.solidDeposit(surface, t, "the liquid-droplet crystallisation picture");
        if (solid.isPresent()) {
            return Prediction.notApplicable(solid.get());
        }
        ModelSupport.supercooledNote(surface, t).ifPresent(notes::add);

        List<String> reasons = new ArrayList<>();
        double n0 = surface.sitesPerCm2();
        double atoms = coverage * n0 / density;
        if (atoms < 1) {
            reasons.add("fewer than one metal atom per droplet (coverage " + ModelSupport.sig3(coverage)
                    + " ML at " + ModelSupport.sig3(density) + " cm^-2)");
        }
        double liquidDensity = surface.liquidAtomDensityPerNm3().getAsDouble();
        double radius = ModelSupport.capBaseRadiusNm(atoms, liquidDensity, parameters.get(CONTACT_ANGLE));
        double sticking = sticking(conditions, surface, parameters, notes);

        boolean noFlux = flux <= 0;
        double lnFlux = Math.log(Math.max(flux, FLUX_FLOOR));
        double lnLength = lnMigrationLengthNm(t, Math.max(flux, FLUX_FLOOR), sticking,
                parameters.get(MIGRATION_BARRIER), parameters.get(ATTEMPT_FREQUENCY), n0);
        double lnLambda = lnLength - Math.log(radius);

        double width = parameters.get(REGIME_WIDTH);
        double cutDot = parameters.get(DOT_RING_CUT);
        double cutRing = cutDot + parameters.get(RING_DISK_GAP);
        double upToDot = ModelSupport.logistic((cutDot - lnLambda) / width);
        double upToRing = Math.max(upToDot, ModelSupport.logistic((cutRing - lnLambda) / width));

        double hotEnough = ModelSupport.logistic((t - parameters.get(ETCHING_ONSET_TEMPERATURE))
                / parameters.get(ETCHING_ONSET_WIDTH));
        double starved = noFlux ? 1.0 : ModelSupport.logistic(
                (Math.log(parameters.get(ETCHING_FLUX_THRESHOLD)) - lnFlux) / parameters.get(ETCHING_FLUX_WIDTH));
        double hole = hotEnough * starved;
        double rest = 1.0 - hole;

        Map<String, Double> probabilities = new LinkedHashMap<>();
        probabilities.put(DOT, rest * upToDot);
        probabilities.put(RING, rest * (upToRing - upToDot));
        probabilities.put(DISK, rest * (1.0 - upToRing));
        probabilities.put(HOLE, hole);

        Map<Role, Double> values = new EnumMap<>(Role.class);
        String metal = surface.depositMetal().get();
        carriedOverDefaults(metal, parameters).ifPresent(notes::add);
        if (noFlux) {
            if (hole < 0.5) {
                reasons.add("with no group-V flux the " + metal + " droplets stay liquid below the etching onset ("
                        + ModelSupport.celsius(parameters.get(ETCHING_ONSET_TEMPERATURE)) + "); nothing crystallises");
            }
            notes.add(String.format(Locale.ROOT, "no group-V flux: droplet base radius %s nm", ModelSupport.sig3(radius)));
        } else {
            double length = Math.exp(lnLength);
            double halfSpacing = 0.5 * ModelSupport.NM_PER_CM / Math.sqrt(density);
            double spread = length * halfSpacing / (length + halfSpacing);
            notes.add(metal + " migration length during crystallisation about " + ModelSupport.sig3(length)
                    + " nm against a droplet base radius of " + ModelSupport.sig3(radius) + " nm");
            if (surface.crystalCationDensityPerNm3().isPresent()) {
                double crystalRadius = crystalBaseRadiusNm(atoms, liquidDensity,
                        surface.crystalCationDensityPerNm3().getAsDouble(), parameters.get(CONTACT_ANGLE));
                values.put(Role.ISLAND_DIAMETER,
                        2 * (crystalRadius + parameters.get(SPREAD_FACTOR) * spread * (1.0 - upToDot)));
            } else {
                notes.add("the compound of " + metal + " and " + surface.groupV()
                        + " is not in the material table; the crystallised diameter is not computed");
            }
        }
        if ("GaAs".equals(surface.substrate()) && t > CONGRUENT_EVAPORATION_GAAS_K && starved > 0.5) {
            notes.add("above about " + ModelSupport.celsius(CONGRUENT_EVAPORATION_GAAS_K) + " GaAs evaporates "
                    + "incongruently without enough As flux and Ga droplets form by themselves");
        }
        // too few atoms per droplet depends on the recipe and the upstream density, not on these parameters
        Validity validity = reasons.isEmpty() ? Validity.ok() : atoms < 1
                ? Validity.notApplicable(String.join("; ", reasons)) : Validity.outside(String.join("; ", reasons));
        return new Prediction(values, Map.of(Role.MORPHOLOGY, probabilities), validity, notes);
    }

    /**
     * Metal migration length during crystallisation, {@code L = sqrt(D_c · tau)} with
     * {@code D_c = (nu0/4)·a²·exp(−E_c/k_B T)}, {@code a² = 1/N0} and {@code tau = N0/(s·J_V)}.
     *
     * @param temperatureK       crystallisation temperature in K; positive
     * @param groupVAtomFlux     group-V atom flux in atoms cm^-2 s^-1; positive
     * @param sticking           sticking coefficient of the group-V species, in (0, 1]
     * @param barrierEv          migration barrier E_c in eV
     * @param attemptFrequencyHz total attempt frequency nu0 in Hz; positive
     * @param sitesPerCm2        surface sites per ML, N0, in cm^-2; positive
     * @return L in nm
     */
    public static double migrationLengthNm(double temperatureK, double groupVAtomFlux, double sticking,
                                           double barrierEv, double attemptFrequencyHz, double sitesPerCm2) {
        return Math.exp(lnMigrationLengthNm(temperatureK, groupVAtomFlux, sticking, barrierEv, attemptFrequencyHz,
                sitesPerCm2));
    }

    private static double lnMigrationLengthNm(double t, double flux, double sticking, double barrierEv,
                                              double attemptHz, double n0) {
        double lnDiffusionNm2PerS = Math.log(attemptHz / 4.0) + Math.log(ModelSupport.NM2_PER_CM2 / n0)
                - barrierEv / (NucleationLaw.BOLTZMANN_EV_PER_K * t);
        double lnTau = Math.log(n0) - Math.log(sticking) - Math.log(flux);
        return 0.5 * (lnDiffusionNm2PerS + lnTau);
    }

    /**
     * Volume of the crystallised compound per volume of the liquid droplet it came from: each metal atom of
     * the droplet becomes one cation of the compound, so the ratio is {@code n_liquid / n_crystal}.
     *
     * @param liquidAtomsPerNm3    atoms per nm^3 in the liquid metal; positive
     * @param crystalCationsPerNm3 group-III atoms per nm^3 in the compound (4/a^3 for zinc blende); positive
     * @return the volume ratio, for example about 2.38 for Ga into GaAs
     */
    public static double crystalToLiquidVolumeRatio(double liquidAtomsPerNm3, double crystalCationsPerNm3) {
        if (!(liquidAtomsPerNm3 > 0) || !(crystalCationsPerNm3 > 0)) {
            throw new IllegalArgumentException("atom densities must be positive");
        }
        return liquidAtomsPerNm3 / crystalCationsPerNm3;
    }

    /**
     * Base radius of the crystallised dot: a spherical cap of the droplet's contact angle holding the droplet's
     * metal atoms as the compound, that is the droplet's base radius times the cube root of
     * {@link #crystalToLiquidVolumeRatio}.
     *
     * @param atoms                metal atoms in the droplet; positive
     * @param liquidAtomsPerNm3    atoms per nm^3 in the liquid metal; positive
     * @param crystalCationsPerNm3 group-III atoms per nm^3 in the compound; positive
     * @param contactAngleDeg      contact angle in degrees, strictly between 0 and 180
     * @return the dot's base radius in nm
     */
    public static double crystalBaseRadiusNm(double atoms, double liquidAtomsPerNm3, double crystalCationsPerNm3,
                                             double contactAngleDeg) {
        double ratio = crystalToLiquidVolumeRatio(liquidAtomsPerNm3, crystalCationsPerNm3);
        return ModelSupport.capBaseRadiusNm(atoms, liquidAtomsPerNm3, contactAngleDeg) * Math.cbrt(ratio);
    }

    /**
     * The group-V molecule whose sticking applies: the run's species, else the surface's default molecule
     * ({@link Surface#defaultGroupVSpecies()}, the same table the BEP-to-flux conversion follows).
     *
     * @param species the run's species text, possibly empty
     * @param surface the growth surface
     * @return the spelling used, for example {@code "P2"}; empty when none is given and none is known
     */
    static Optional<String> assumedSpecies(Optional<String> species, Surface surface) {
        Optional<String> given = species.map(String::trim).filter(s -> !s.isEmpty()).filter(DropletCrystallizationModel::recognised);
        return given.isPresent() ? given : surface.defaultGroupVSpecies();
    }

    private static boolean recognised(String s) {
        return s.matches("(As|Sb|P)[24]?");
    }

    private static double sticking(Conditions conditions, Surface surface, ParameterValues parameters,
                                   List<String> notes) {
        Optional<String> given = conditions.category(Role.GROUP_V_SPECIES).map(String::trim).filter(s -> !s.isEmpty());
        Optional<String> used = assumedSpecies(given, surface);
        if (used.isEmpty()) {
            notes.add("group-V species not given and no default known for the group-V element; tetramer sticking assumed");
            return parameters.get(TETRAMER_STICKING);
        }
        String s = used.get();
        if (given.isEmpty()) {
            notes.add("group-V species not given; " + s + " assumed (the same molecule the BEP-to-flux conversion assumes)");
        } else if (!given.get().equals(s)) {
            notes.add("group-V species '" + given.get() + "' not recognised; " + s + " assumed");
        }
        return s.endsWith("4") ? parameters.get(TETRAMER_STICKING) : parameters.get(DIMER_STICKING);
    }

    private static Optional<String> carriedOverDefaults(String metal, ParameterValues parameters) {
        if (DEFAULTS_METAL.equals(metal)) {
            return Optional.empty();
        }
        List<String> carried = new ArrayList<>();
        if (parameters.get(MIGRATION_BARRIER) == DEFAULT_MIGRATION_BARRIER_EV) {
            carried.add(MIGRATION_BARRIER);
        }
        if (parameters.get(ETCHING_ONSET_TEMPERATURE) == DEFAULT_ETCHING_ONSET_K) {
            carried.add(ETCHING_ONSET_TEMPERATURE);
        }
        if (carried.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of(String.join(" and ", carried) + " at the published Ga default: no published value for "
                + metal + " droplets was found, so the Ga value is carried over; fit it from the lab's runs");
    }
}
