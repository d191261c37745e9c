package dev.terrace.core.campaign;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Built-in temperature reference events a grower can watch on the substrate holder, with their
 * accepted true temperatures, the standard uncertainty of that value and its source. A campaign's
 * {@code temperature_calibration:} names one by its {@link #key()}; any other event is custom and
 * carries its own true value, uncertainty and source.
 *
 * <p>The metal melting and freezing points are defining fixed points of the International
 * Temperature Scale of 1990: H. Preston-Thomas, "The International Temperature Scale of 1990
 * (ITS-90)", Metrologia 27, 3-10 (1990), Table 1. Their values are exact by definition, so the
 * uncertainty of an offset taken from them is the uncertainty of the reading alone (how well the
 * melt is seen on the holder while the temperature ramps).
 *
 * @since 0.3
 */
public enum ReferenceEvent {

    /** Melting point of gallium, 302.9146 K (29.7646 °C): ITS-90 defining fixed point. */
    GALLIUM_MELTING("gallium_melting", 302.9146, 0,
            "ITS-90 melting point of Ga, 302.9146 K (Preston-Thomas, Metrologia 27, 3 (1990), Table 1)"),
    /** Freezing point of indium, 429.7485 K (156.5985 °C): ITS-90 defining fixed point. */
    INDIUM_MELTING("indium_melting", 429.7485, 0,
            "ITS-90 freezing point of In, 429.7485 K (Preston-Thomas, Metrologia 27, 3 (1990), Table 1)"),
    /** Freezing point of tin, 505.078 K (231.928 °C): ITS-90 defining fixed point. */
    TIN_MELTING("tin_melting", 505.078, 0,
            "ITS-90 freezing point of Sn, 505.078 K (Preston-Thomas, Metrologia 27, 3 (1990), Table 1)"),
    /** Freezing point of aluminium, 933.473 K (660.323 °C): ITS-90 defining fixed point. */
    ALUMINIUM_MELTING("aluminium_melting", 933.473, 0,
            "ITS-90 freezing point of Al, 933.473 K (Preston-Thomas, Metrologia 27, 3 (1990), Table 1)"),
    /**
     * Desorption of the native oxide of an epi-ready GaAs(001) wafer, about 580 °C, with a standard
     * uncertainty of {@value #OXIDE_DESORPTION_UNCERTAINTY_K} K. In situ spectroscopic ellipsometry
     * without arsenic shows the oxide leaving at about 580 °C ("GaAs(100) surface modifications at
     * elevated temperatures, studied by in-situ spectroscopic ellipsometry", MRS Online Proceedings
     * Library); common practice places the RHEED change under an As flux anywhere from 580 to 620 °C
     * depending on the oxide and the wafer supplier, hence the wide uncertainty, which keeps 620 °C
     * within two standard uncertainties.
     */
    GAAS_OXIDE_DESORPTION("gaas_oxide_desorption", 580 + 273.15, ReferenceEvent.OXIDE_DESORPTION_UNCERTAINTY_K,
            "GaAs(001) native-oxide desorption, about 580 degC (in situ spectroscopic ellipsometry, MRS Online"
                    + " Proceedings Library, 'GaAs(100) surface modifications at elevated temperatures'); common"
                    + " practice: 580-620 degC under As, seen by RHEED");

    /**
     * Standard uncertainty of the GaAs oxide-desorption temperature, 20 K: half the spread of the
     * 580-620 °C range seen in common practice (RHEED under As), so the upper end lies two standard
     * uncertainties above the accepted 580 °C.
     */
    public static final double OXIDE_DESORPTION_UNCERTAINTY_K = 20;

    private final String key;
    private final double trueKelvin;
    private final double uncertaintyK;
    private final String source;

    ReferenceEvent(String key, double trueKelvin, double uncertaintyK, String source) {
        this.key = key;
        this.trueKelvin = trueKelvin;
        this.uncertaintyK = uncertaintyK;
        this.source = source;
    }

    /** @return the name written in a campaign file; never null */
    public String key() {
        return key;
    }

    /** @return the accepted true temperature in kelvin */
    public double trueKelvin() {
        return trueKelvin;
    }

    /** @return the standard uncertainty of the accepted value in kelvin (0 for a defining fixed point) */
    public double uncertaintyK() {
        return uncertaintyK;
    }

    /** @return where the accepted value comes from; never null */
    public String source() {
        return source;
    }

    /**
     * @param key a name from a campaign file
     * @return the built-in event of that name, if any
     */
    public static Optional<ReferenceEvent> byKey(String key) {
        return Arrays.stream(values()).filter(e -> e.key.equals(key == null ? null : key.toLowerCase(Locale.ROOT)))
                .findFirst();
    }

    /** @return the names of the built-in events, in declaration order; never null */
    public static List<String> keys() {
        return Arrays.stream(values()).map(ReferenceEvent::key).toList();
    }
}
