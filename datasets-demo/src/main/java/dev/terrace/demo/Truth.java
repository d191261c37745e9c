package dev.terrace.demo;

/**
 * The invented ground truth of a {@link VirtualChamber}: the "real" physics of a made-up MBE
 * chamber, hidden from the fitting code. Nothing here is a measurement; every default below is
 * invented for Terrace's demo, tests and benchmarks, chosen to sit inside published ranges where
 * a range is cited.
 *
 * <p>The truth differs on purpose from Terrace's growth-model plugins, so that a fit to
 * chamber data is a real test and not a round trip:
 * <ul>
 *   <li>the thermocouple reads off the surface temperature by {@link #thermocoupleOffsetK()};</li>
 *   <li>the critical nucleus grows from one to two atoms with temperature ({@link Nucleation});</li>
 *   <li>the surface reconstruction switches the effective diffusion barrier ({@link Nucleation});</li>
 *   <li>droplets ripen during deposition and ramps ({@link Nucleation#ripeningTimeS()});</li>
 *   <li>the droplet contact angle changes with temperature ({@link Shape});</li>
 *   <li>the crystallised shape follows the chamber's own "Ga reach" criterion, with its own cut
 *       points and a smooth seeded random component ({@link Shape});</li>
 *   <li>holes form by local droplet etching when hot with almost no group-V flux ({@link Etching});</li>
 *   <li>step flow follows its own capture-length criterion ({@link Film});</li>
 *   <li>the gauge misreads the group-V flux by {@link Supply#gaugeFluxFactor()}.</li>
 * </ul>
 *
 * @param thermocoupleOffsetK surface temperature minus thermocouple reading, in K; finite, within &plusmn;100 K
 * @param supply              group-V supply; never null
 * @param nucleation          droplet and island nucleation; never null
 * @param shape               droplet shape and crystallised morphology; never null
 * @param etching             local droplet etching (holes); never null
 * @param film                film growth: step flow against islands; never null
 * @param mishaps             failed runs; never null
 * @since 0.1
 */
public record Truth(double thermocoupleOffsetK, Supply supply, Nucleation nucleation, Shape shape,
                   Etching etching, Film film, Mishaps mishaps) {

    /**
     * Default thermocouple offset, -15 K: the surface is 15 K colder than the reading. Invented;
     * offsets of this size are common between a thermocouple behind the wafer and the surface,
     * which is why growers calibrate on the oxide desorption near 580 &deg;C [practice].
     */
    public static final double DEFAULT_THERMOCOUPLE_OFFSET_K = -15.0;

    /** Checks the invariants. */
    public Truth {
        finiteWithin("thermocoupleOffsetK", thermocoupleOffsetK, -100, 100);
        java.util.Objects.requireNonNull(supply, "supply");
        java.util.Objects.requireNonNull(nucleation, "nucleation");
        java.util.Objects.requireNonNull(shape, "shape");
        java.util.Objects.requireNonNull(etching, "etching");
        java.util.Objects.requireNonNull(film, "film");
        java.util.Objects.requireNonNull(mishaps, "mishaps");
    }

    /** @return the invented default truth; never null */
    public static Truth defaults() {
        return new Truth(DEFAULT_THERMOCOUPLE_OFFSET_K, Supply.defaults(), Nucleation.defaults(), Shape.defaults(),
                Etching.defaults(), Film.defaults(), Mishaps.defaults());
    }

    /**
     * @param offsetK the new thermocouple offset in K
     * @return a copy with that offset; never null
     */
    public Truth withThermocoupleOffsetK(double offsetK) {
        return new Truth(offsetK, supply, nucleation, shape, etching, film, mishaps);
    }

    /**
     * @param value the new nucleation truth; never null
     * @return a copy with it; never null
     */
    public Truth withNucleation(Nucleation value) {
        return new Truth(thermocoupleOffsetK, supply, value, shape, etching, film, mishaps);
    }

    /**
     * @param value the new shape truth; never null
     * @return a copy with it; never null
     */
    public Truth withShape(Shape value) {
        return new Truth(thermocoupleOffsetK, supply, nucleation, value, etching, film, mishaps);
    }

    /**
     * @param value the new mishap truth; never null
     * @return a copy with it; never null
     */
    public Truth withMishaps(Mishaps value) {
        return new Truth(thermocoupleOffsetK, supply, nucleation, shape, etching, film, value);
    }

    /**
     * How much group-V flux reaches the surface and sticks.
     *
     * @param gaugeFluxFactor   true flux over the flux estimated from the gauge's BEP reading; positive
     * @param tetramerSticking  sticking coefficient of tetramers (As4, Sb4, P4), in (0, 1]
     * @param dimerSticking     sticking coefficient of dimers and monomers, in (0, 1]
     * @param backgroundFlux    group-V atoms per cm^2 per s reaching the surface with the valve closed; non-negative
     */
    public record Supply(double gaugeFluxFactor, double tetramerSticking, double dimerSticking,
                         double backgroundFlux) {

        /**
         * Default gauge factor, 0.8: the chamber's gauge reads 25 % high. Invented, inside the
         * factor of 2 within which a single BEP reading gives an absolute flux [practice].
         */
        public static final double DEFAULT_GAUGE_FLUX_FACTOR = 0.8;
        /**
         * Default tetramer sticking, 0.45. Invented, just below the accepted maximum of 0.5 for
         * As4 on GaAs(001) (Foxon and Joyce, Surf. Sci. 50, 434 (1975)).
         */
        public static final double DEFAULT_TETRAMER_STICKING = 0.45;
        /**
         * Default dimer sticking, 0.95. Invented, just below the near-unity As2 sticking on
         * Ga-covered sites (Foxon and Joyce, Surf. Sci. 64, 293 (1977); from memory).
         */
        public static final double DEFAULT_DIMER_STICKING = 0.95;
        /** Default background group-V flux with the valve closed, 1e11 cm^-2 s^-1. Invented. */
        public static final double DEFAULT_BACKGROUND_FLUX = 1e11;

        /** Checks the invariants. */
        public Supply {
            positive("gaugeFluxFactor", gaugeFluxFactor);
            finiteWithin("tetramerSticking", tetramerSticking, 1e-6, 1);
            finiteWithin("dimerSticking", dimerSticking, 1e-6, 1);
            finiteWithin("backgroundFlux", backgroundFlux, 0, 1e20);
        }

        /** @return the invented defaults; never null */
        public static Supply defaults() {
            return new Supply(DEFAULT_GAUGE_FLUX_FACTOR, DEFAULT_TETRAMER_STICKING, DEFAULT_DIMER_STICKING,
                    DEFAULT_BACKGROUND_FLUX);
        }
    }

    /**
     * How many droplets (or 2D islands) nucleate and survive. The density follows rate-equation
     * scaling, N = &eta; N0 (F/D)^(i/(i+&alpha;)) exp(E_i/((i+&alpha;) kT)) (Venables, Spiller and
     * Hanb&uuml;cken, Rep. Prog. Phys. 47, 399 (1984)), but with the chamber's own twists: D is
     * &nu; exp(-E/kT) per site (no factor 1/4); the barrier E steps up by
     * {@link #reconstructionStepEv()} when the As-rich c(4&times;4) surface gives way to (2&times;4)
     * at high temperature or low group-V supply; ln N blends from i = 1 to i = 2 across
     * {@link #criticalSizeMidK()}; and droplets ripen, N falling as (1 + t/&tau;)^-3/4.
     *
     * @param prefactor                  &eta; for droplets, in (0, 1]
     * @param attemptFrequencyHz         &nu;, hops per second at infinite temperature; positive
     * @param barrierAsRichEv            diffusion barrier on the As-rich c(4&times;4) surface, eV; positive
     * @param reconstructionStepEv       extra barrier on (2&times;4), eV; finite
     * @param reconstructionMidK         surface temperature of the c(4&times;4)/(2&times;4) change at the
     *                                   reference flux, K; positive
     * @param reconstructionKPerDecade   shift of that temperature per decade of group-V flux, K; finite
     * @param reconstructionWidthK       width of the change, K; positive
     * @param reconstructionReferenceFlux the reference group-V flux, atoms cm^-2 s^-1; positive
     * @param criticalSizeMidK           surface temperature where i is halfway from 1 to 2, K; positive
     * @param criticalSizeWidthK         width of that change, K; positive
     * @param pairBindingEv              binding energy E_2 of the two-atom nucleus, eV; non-negative
     * @param ripeningTimeS              ripening time at 573.15 K, s; positive
     * @param ripeningBarrierEv          activation energy of ripening, eV; non-negative
     * @param surfactantShiftEv          barrier lowering by a full surfactant layer, eV; non-negative
     * @param densityRoughness           standard deviation of a smooth seeded random term in ln N; non-negative
     */
    public record Nucleation(double prefactor, double attemptFrequencyHz, double barrierAsRichEv,
                             double reconstructionStepEv, double reconstructionMidK, double reconstructionKPerDecade,
                             double reconstructionWidthK, double reconstructionReferenceFlux, double criticalSizeMidK,
                             double criticalSizeWidthK, double pairBindingEv, double ripeningTimeS,
                             double ripeningBarrierEv, double surfactantShiftEv, double densityRoughness) {

        /**
         * Default droplet prefactor &eta;, 0.01. Invented: far below the 0.25 of point-island theory,
         * so that densities land where droplet-epitaxy reports put them (about 1e11 cm^-2 near
         * 200 &deg;C, Appl. Phys. Lett. 100 (21) (2012), doi 10.1063/1.4721663).
         */
        public static final double DEFAULT_PREFACTOR = 0.01;
        /** Default attempt frequency, 1e13 Hz [practice]; DFT finds about 1 THz (Ratsch and Scheffler, PRB 58, 13163 (1998)). */
        public static final double DEFAULT_ATTEMPT_FREQUENCY_HZ = 1e13;
        /**
         * Default barrier on As-rich c(4&times;4), 0.65 eV. Invented, inside the 0.7 &plusmn; 0.1 eV of
         * Wang et al., Chin. Phys. B 29, 046801 (2020).
         */
        public static final double DEFAULT_BARRIER_AS_RICH_EV = 0.65;
        /**
         * Default barrier step on (2&times;4), +0.12 eV. Invented. Its sign follows Ohtake et al.
         * (Cryst. Growth Des., 2014 from memory): Ga droplets are far denser on less As-rich surfaces.
         */
        public static final double DEFAULT_RECONSTRUCTION_STEP_EV = 0.12;
        /**
         * Default reconstruction change, 560 K surface temperature at the reference flux. Invented.
         * It is lower than the c(4&times;4) to (2&times;4) change seen under a steady As beam because in
         * droplet epitaxy the valve is closed before Ga goes down and the surface loses As.
         */
        public static final double DEFAULT_RECONSTRUCTION_MID_K = 560.0;
        /** Default shift of the reconstruction change, +30 K per decade of group-V flux. Invented. */
        public static final double DEFAULT_RECONSTRUCTION_K_PER_DECADE = 30.0;
        /** Default width of the reconstruction change, 20 K. Invented. */
        public static final double DEFAULT_RECONSTRUCTION_WIDTH_K = 20.0;
        /** Default reference group-V flux, 5e14 atoms cm^-2 s^-1 (about 1e-6 Torr As4 on this gauge). Invented. */
        public static final double DEFAULT_RECONSTRUCTION_REFERENCE_FLUX = 5e14;
        /**
         * Default midpoint of the i = 1 to i = 2 change, 520 K. Invented; a critical cluster of
         * one to two atoms is reported for Ga droplets by Tuktamyshev et al., Sci. Rep. 11 (2021).
         */
        public static final double DEFAULT_CRITICAL_SIZE_MID_K = 520.0;
        /** Default width of the critical-size change, 20 K. Invented. */
        public static final double DEFAULT_CRITICAL_SIZE_WIDTH_K = 20.0;
        /** Default pair binding energy E_2, 0.15 eV. Invented. */
        public static final double DEFAULT_PAIR_BINDING_EV = 0.15;
        /** Default ripening time at 573.15 K, 30 s. Invented. */
        public static final double DEFAULT_RIPENING_TIME_S = 30.0;
        /**
         * Default ripening activation energy, 0.9 eV. Invented; with the ripening time it leaves
         * droplets at 620 &deg;C a few 1e6 cm^-2 apart, the order of the 2e6 cm^-2 hole density
         * Heyn et al. (2014) found at 650 &deg;C.
         */
        public static final double DEFAULT_RIPENING_BARRIER_EV = 0.9;
        /** Default barrier lowering by a full surfactant layer, 0.1 eV. Invented. */
        public static final double DEFAULT_SURFACTANT_SHIFT_EV = 0.1;
        /** Default smooth random term in ln N, standard deviation 0.1. Invented. */
        public static final double DEFAULT_DENSITY_ROUGHNESS = 0.1;

        /** Checks the invariants. */
        public Nucleation {
            finiteWithin("prefactor", prefactor, 1e-9, 1);
            positive("attemptFrequencyHz", attemptFrequencyHz);
            finiteWithin("barrierAsRichEv", barrierAsRichEv, 1e-3, 5);
            finiteWithin("reconstructionStepEv", reconstructionStepEv, -1, 1);
            positive("reconstructionMidK", reconstructionMidK);
            finiteWithin("reconstructionKPerDecade", reconstructionKPerDecade, -500, 500);
            positive("reconstructionWidthK", reconstructionWidthK);
            positive("reconstructionReferenceFlux", reconstructionReferenceFlux);
            positive("criticalSizeMidK", criticalSizeMidK);
            positive("criticalSizeWidthK", criticalSizeWidthK);
            finiteWithin("pairBindingEv", pairBindingEv, 0, 5);
            positive("ripeningTimeS", ripeningTimeS);
            finiteWithin("ripeningBarrierEv", ripeningBarrierEv, 0, 10);
            finiteWithin("surfactantShiftEv", surfactantShiftEv, 0, 2);
            finiteWithin("densityRoughness", densityRoughness, 0, 3);
        }

        /** @return the invented defaults; never null */
        public static Nucleation defaults() {
            return new Nucleation(DEFAULT_PREFACTOR, DEFAULT_ATTEMPT_FREQUENCY_HZ, DEFAULT_BARRIER_AS_RICH_EV,
                    DEFAULT_RECONSTRUCTION_STEP_EV, DEFAULT_RECONSTRUCTION_MID_K, DEFAULT_RECONSTRUCTION_K_PER_DECADE,
                    DEFAULT_RECONSTRUCTION_WIDTH_K, DEFAULT_RECONSTRUCTION_REFERENCE_FLUX, DEFAULT_CRITICAL_SIZE_MID_K,
                    DEFAULT_CRITICAL_SIZE_WIDTH_K, DEFAULT_PAIR_BINDING_EV, DEFAULT_RIPENING_TIME_S,
                    DEFAULT_RIPENING_BARRIER_EV, DEFAULT_SURFACTANT_SHIFT_EV, DEFAULT_DENSITY_ROUGHNESS);
        }

        /**
         * @param roughness the new standard deviation of the smooth random term in ln N
         * @return a copy with it; never null
         */
        public Nucleation withDensityRoughness(double roughness) {
            return new Nucleation(prefactor, attemptFrequencyHz, barrierAsRichEv, reconstructionStepEv,
                    reconstructionMidK, reconstructionKPerDecade, reconstructionWidthK, reconstructionReferenceFlux,
                    criticalSizeMidK, criticalSizeWidthK, pairBindingEv, ripeningTimeS, ripeningBarrierEv,
                    surfactantShiftEv, roughness);
        }
    }

    /**
     * Droplet shape and the morphology after crystallisation. A droplet is a spherical cap whose
     * contact angle rises smoothly from {@link #contactAngleColdDeg()} to {@link #contactAngleHotDeg()}
     * around {@link #contactAngleMidK()}. Its crystallised shape follows the chamber's own score
     * s = ln(&Lambda;/r) + g, where r is the droplet's base radius, g a smooth seeded random term of
     * standard deviation {@link #roughness()}, and the "Ga reach" &Lambda; = a (D_c/F_V)^(1/3) grows
     * as the cube root of Ga hops (barrier {@link #reachBarrierEv()} at the crystallisation
     * temperature) per arriving group-V atom per site, a being the surface-site spacing. Dots below
     * {@link #dotRingCut()}, rings between, disks above {@link #ringDiskCut()}, each edge a logistic
     * of width {@link #softness()}. The cube root and the cut points are invented.
     *
     * @param contactAngleColdDeg contact angle at low temperature, degrees, in (0, 180)
     * @param contactAngleHotDeg  contact angle at high temperature, degrees, in (0, 180)
     * @param contactAngleMidK    surface temperature halfway between the two, K; positive
     * @param contactAngleWidthK  width of the change, K; positive
     * @param reachBarrierEv      barrier for Ga leaving the droplet under group-V flux, eV; positive
     * @param dotRingCut          score below which the droplet crystallises as a dot; finite
     * @param ringDiskCut         score above which it spreads into a disk; above {@code dotRingCut}
     * @param softness            logistic width of both cuts; positive
     * @param roughness           standard deviation of the smooth seeded random term; non-negative
     */
    public record Shape(double contactAngleColdDeg, double contactAngleHotDeg, double contactAngleMidK,
                        double contactAngleWidthK, double reachBarrierEv, double dotRingCut, double ringDiskCut,
                        double softness, double roughness) {

        /** Default cold contact angle, 55&deg;. Invented; Ga droplets on GaAs wet with angles below 90&deg; (from memory). */
        public static final double DEFAULT_CONTACT_ANGLE_COLD_DEG = 55.0;
        /** Default hot contact angle, 75&deg;. Invented. */
        public static final double DEFAULT_CONTACT_ANGLE_HOT_DEG = 75.0;
        /** Default midpoint of the contact-angle change, 520 K. Invented. */
        public static final double DEFAULT_CONTACT_ANGLE_MID_K = 520.0;
        /** Default width of the contact-angle change, 40 K. Invented. */
        public static final double DEFAULT_CONTACT_ANGLE_WIDTH_K = 40.0;
        /**
         * Default reach barrier, 1.2 eV. Invented: Ga must leave the liquid and migrate over an
         * As-exposed surface, harder than the 0.7 &plusmn; 0.1 eV adatom barrier of Wang et al. (2020).
         */
        public static final double DEFAULT_REACH_BARRIER_EV = 1.2;
        /**
         * Default dot/ring cut, -3.0. Invented, placed so dots form at low temperature and high As
         * flux (Watanabe, Koguchi and Gotoh, JJAP 39, L79 (2000); from memory).
         */
        public static final double DEFAULT_DOT_RING_CUT = -3.0;
        /**
         * Default ring/disk cut, -1.2. Invented, placed so rings and disks form at intermediate
         * temperature and low As flux (Mano et al., Nano Lett. 5, 425 (2005)).
         */
        public static final double DEFAULT_RING_DISK_CUT = -1.2;
        /** Default logistic width of the cuts, 0.25. Invented. */
        public static final double DEFAULT_SOFTNESS = 0.25;
        /** Default smooth random term in the score, standard deviation 0.3. Invented. */
        public static final double DEFAULT_ROUGHNESS = 0.3;

        /** Checks the invariants. */
        public Shape {
            finiteWithin("contactAngleColdDeg", contactAngleColdDeg, 1, 179);
            finiteWithin("contactAngleHotDeg", contactAngleHotDeg, 1, 179);
            positive("contactAngleMidK", contactAngleMidK);
            positive("contactAngleWidthK", contactAngleWidthK);
            finiteWithin("reachBarrierEv", reachBarrierEv, 1e-3, 5);
            finiteWithin("dotRingCut", dotRingCut, -50, 50);
            finiteWithin("ringDiskCut", ringDiskCut, -50, 50);
            if (!(ringDiskCut > dotRingCut)) {
                throw new IllegalArgumentException("ringDiskCut must lie above dotRingCut");
            }
            positive("softness", softness);
            finiteWithin("roughness", roughness, 0, 3);
        }

        /** @return the invented defaults; never null */
        public static Shape defaults() {
            return new Shape(DEFAULT_CONTACT_ANGLE_COLD_DEG, DEFAULT_CONTACT_ANGLE_HOT_DEG, DEFAULT_CONTACT_ANGLE_MID_K,
                    DEFAULT_CONTACT_ANGLE_WIDTH_K, DEFAULT_REACH_BARRIER_EV, DEFAULT_DOT_RING_CUT,
                    DEFAULT_RING_DISK_CUT, DEFAULT_SOFTNESS, DEFAULT_ROUGHNESS);
        }
    }

    /**
     * Local droplet etching: above an onset temperature and with almost no group-V flux, droplets
     * drill holes into the substrate instead of crystallising. The hole probability is the product
     * of two logistics, one in surface temperature and one in log10 of the group-V flux.
     *
     * @param onsetK           surface temperature of half the etching, K; positive
     * @param widthK           logistic width in temperature, K; positive
     * @param fluxThreshold    group-V flux of half the etching, atoms cm^-2 s^-1; positive
     * @param fluxWidthDecades logistic width in log10 of the flux; positive
     */
    public record Etching(double onsetK, double widthK, double fluxThreshold, double fluxWidthDecades) {

        /**
         * Default onset, 833.15 K (560 &deg;C surface). Invented, just below the 570-620 &deg;C at
         * which Ga local droplet etching of GaAs is shown by Heyn et al., Nanoscale Res. Lett. 9,
         * 285 (2014).
         */
        public static final double DEFAULT_ONSET_K = 833.15;
        /** Default temperature width, 12 K. Invented. */
        public static final double DEFAULT_WIDTH_K = 12.0;
        /**
         * Default flux threshold, 5e13 atoms cm^-2 s^-1: about the true flux of 1e-7 Torr As4 in
         * this chamber; local droplet etching needs As below about 1e-7 Torr (Heyn et al. 2014).
         */
        public static final double DEFAULT_FLUX_THRESHOLD = 5e13;
        /** Default flux width, 0.25 decades. Invented. */
        public static final double DEFAULT_FLUX_WIDTH_DECADES = 0.25;

        /** Checks the invariants. */
        public Etching {
            positive("onsetK", onsetK);
            positive("widthK", widthK);
            positive("fluxThreshold", fluxThreshold);
            positive("fluxWidthDecades", fluxWidthDecades);
        }

        /** @return the invented defaults; never null */
        public static Etching defaults() {
            return new Etching(DEFAULT_ONSET_K, DEFAULT_WIDTH_K, DEFAULT_FLUX_THRESHOLD, DEFAULT_FLUX_WIDTH_DECADES);
        }
    }

    /**
     * Film growth on a vicinal surface. 2D islands nucleate with density N (the same law as in
     * {@link Nucleation}, with &alpha; = 2 and the film's own prefactor and barrier); an adatom's
     * capture length is &lambda; = N^-1/2 (R/10)^-p with R the sticking group-V to group-III arrival
     * ratio; the surface grows by step flow when &lambda; beats the terrace width w = h/tan(miscut)
     * by {@link #stepFlowCut()} in ln(&lambda;/w), with a logistic of width {@link #softness()} and
     * a smooth seeded random term. A nominal (zero) miscut has no steps and always gives islands.
     *
     * @param prefactor      &eta; for 2D islands, in (0, 1]
     * @param barrierEv      effective Ga diffusion barrier during growth under group-V flux, eV; positive
     * @param stepFlowCut    ln(&lambda;/w) of half step flow; finite
     * @param softness       logistic width; positive
     * @param vToIiiExponent p, how fast the capture length shrinks with the group-V supply; non-negative
     * @param roughness      standard deviation of the smooth seeded random term; non-negative
     */
    public record Film(double prefactor, double barrierEv, double stepFlowCut, double softness, double vToIiiExponent,
                       double roughness) {

        /**
         * Default 2D prefactor, 0.25, the common choice for i = 1 point islands (Bales and Chrzan,
         * PRB 50, 6057 (1994); from memory).
         */
        public static final double DEFAULT_PREFACTOR = 0.25;
        /**
         * Default film barrier, 1.3 eV. Invented: an effective barrier for Ga under an As beam,
         * between the 0.7 eV of droplet work and the 1.54 eV used in solid-on-solid fits of RHEED
         * (Shitara et al., PRB 46, 6815 (1992); from memory).
         */
        public static final double DEFAULT_BARRIER_EV = 1.3;
        /** Default step-flow cut, ln 1.5: step flow needs &lambda; 1.5 times the terrace width. Invented. */
        public static final double DEFAULT_STEP_FLOW_CUT = 0.4054651081081644;
        /** Default logistic width, 0.25. Invented. */
        public static final double DEFAULT_SOFTNESS = 0.25;
        /**
         * Default supply exponent, 0.2. Invented; its sign follows Nishinaga and Shen, Appl. Surf.
         * Sci. 82-83, 141 (1994): the Ga incorporation length falls as the As pressure rises.
         */
        public static final double DEFAULT_V_TO_III_EXPONENT = 0.2;
        /** Default smooth random term, standard deviation 0.15. Invented. */
        public static final double DEFAULT_ROUGHNESS = 0.15;

        /** Checks the invariants. */
        public Film {
            finiteWithin("prefactor", prefactor, 1e-9, 1);
            finiteWithin("barrierEv", barrierEv, 1e-3, 5);
            finiteWithin("stepFlowCut", stepFlowCut, -20, 20);
            positive("softness", softness);
            finiteWithin("vToIiiExponent", vToIiiExponent, 0, 2);
            finiteWithin("roughness", roughness, 0, 3);
        }

        /** @return the invented defaults; never null */
        public static Film defaults() {
            return new Film(DEFAULT_PREFACTOR, DEFAULT_BARRIER_EV, DEFAULT_STEP_FLOW_CUT, DEFAULT_SOFTNESS,
                    DEFAULT_V_TO_III_EXPONENT, DEFAULT_ROUGHNESS);
        }
    }

    /**
     * Failed runs. Every run may fail with {@link #baseProbability()} for ordinary mishaps, and more
     * often where growers do have trouble: very hot with almost no group-V flux (the surface
     * decomposes, droplets run off), at the hottest end of the heater, and on long ramps between
     * the droplet and the crystallisation temperature. Each extra cause is a probability times a
     * logistic; the causes combine as independent risks.
     *
     * @param baseProbability          probability of an ordinary mishap, in [0, 1)
     * @param decompositionK           surface temperature of half the decomposition risk, K; positive
     * @param decompositionWidthK      its width, K; positive
     * @param decompositionProbability its full probability (hot, no group-V flux), in [0, 1]
     * @param heaterTroubleK           thermocouple reading of half the heater risk, K; positive
     * @param heaterWidthK             its width, K; positive
     * @param heaterProbability        its full probability, in [0, 1]
     * @param rampLimitK               temperature change between droplet and crystallisation step
     *                                 of half the ramp risk, K; positive
     * @param rampWidthK               its width, K; positive
     * @param rampProbability          its full probability, in [0, 1]
     */
    public record Mishaps(double baseProbability, double decompositionK, double decompositionWidthK,
                          double decompositionProbability, double heaterTroubleK, double heaterWidthK,
                          double heaterProbability, double rampLimitK, double rampWidthK, double rampProbability) {

        /** Default base failure probability, 0.04. Invented: a few runs in a hundred are lost to ordinary mishaps. */
        public static final double DEFAULT_BASE_PROBABILITY = 0.04;
        /**
         * Default decomposition temperature, 898.15 K (625 &deg;C), the congruent evaporation
         * temperature of GaAs quoted by Heyn et al. (2014); above it, without As, Ga droplets form
         * and run (Zhou et al., APL (2010)).
         */
        public static final double DEFAULT_DECOMPOSITION_K = 898.15;
        /** Default decomposition width, 10 K. Invented. */
        public static final double DEFAULT_DECOMPOSITION_WIDTH_K = 10.0;
        /** Default full decomposition risk, 0.6. Invented. */
        public static final double DEFAULT_DECOMPOSITION_PROBABILITY = 0.6;
        /** Default heater trouble reading, 1023.15 K (750 &deg;C). Invented. */
        public static final double DEFAULT_HEATER_TROUBLE_K = 1023.15;
        /** Default heater width, 15 K. Invented. */
        public static final double DEFAULT_HEATER_WIDTH_K = 15.0;
        /** Default full heater risk, 0.3. Invented. */
        public static final double DEFAULT_HEATER_PROBABILITY = 0.3;
        /** Default ramp limit, 120 K. Invented. */
        public static final double DEFAULT_RAMP_LIMIT_K = 90.0;
        /** Default ramp width, 12 K. Invented. */
        public static final double DEFAULT_RAMP_WIDTH_K = 12.0;
        /** Default full ramp risk, 0.35. Invented. */
        public static final double DEFAULT_RAMP_PROBABILITY = 0.35;

        /** Checks the invariants. */
        public Mishaps {
            finiteWithin("baseProbability", baseProbability, 0, 0.999);
            positive("decompositionK", decompositionK);
            positive("decompositionWidthK", decompositionWidthK);
            finiteWithin("decompositionProbability", decompositionProbability, 0, 1);
            positive("heaterTroubleK", heaterTroubleK);
            positive("heaterWidthK", heaterWidthK);
            finiteWithin("heaterProbability", heaterProbability, 0, 1);
            positive("rampLimitK", rampLimitK);
            positive("rampWidthK", rampWidthK);
            finiteWithin("rampProbability", rampProbability, 0, 1);
        }

        /** @return the invented defaults; never null */
        public static Mishaps defaults() {
            return new Mishaps(DEFAULT_BASE_PROBABILITY, DEFAULT_DECOMPOSITION_K, DEFAULT_DECOMPOSITION_WIDTH_K,
                    DEFAULT_DECOMPOSITION_PROBABILITY, DEFAULT_HEATER_TROUBLE_K, DEFAULT_HEATER_WIDTH_K,
                    DEFAULT_HEATER_PROBABILITY, DEFAULT_RAMP_LIMIT_K, DEFAULT_RAMP_WIDTH_K, DEFAULT_RAMP_PROBABILITY);
        }

        /**
         * @param probability the new base failure probability
         * @return a copy with it; never null
         */
        public Mishaps withBaseProbability(double probability) {
            return new Mishaps(probability, decompositionK, decompositionWidthK, decompositionProbability,
                    heaterTroubleK, heaterWidthK, heaterProbability, rampLimitK, rampWidthK, rampProbability);
        }
    }

    private static void positive(String name, double v) {
        if (!(v > 0) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be positive and finite, got " + v);
        }
    }

    private static void finiteWithin(String name, double v, double lo, double hi) {
        if (!(v >= lo && v <= hi)) {
            throw new IllegalArgumentException(name + " must lie in [" + lo + ", " + hi + "], got " + v);
        }
    }
}
