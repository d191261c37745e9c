package dev.terrace.models;

import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Surface;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Small numeric helpers shared by the plugins of this package.
 *
 * @since 0.1
 */
final class ModelSupport {

    /** Kelvin at 0 °C (exact, ITS-90 definition of the Celsius scale). */
    static final double ZERO_CELSIUS_K = 273.15;

    /** Square nanometres per square centimetre. */
    static final double NM2_PER_CM2 = 1e14;

    /** Nanometres per centimetre. */
    static final double NM_PER_CM = 1e7;

    private ModelSupport() {
    }

    /**
     * The logistic function {@code 1/(1+exp(−x))}, computed without overflow.
     *
     * @param x any finite or infinite number
     * @return a value in [0, 1]
     */
    static double logistic(double x) {
        if (x >= 0) {
            return 1.0 / (1.0 + Math.exp(-x));
        }
        double e = Math.exp(x);
        return e / (1.0 + e);
    }

    /**
     * Base radius of a spherical-cap droplet holding a given number of atoms.
     *
     * <p>A cap of base radius r and contact angle θ has volume
     * {@code V = (π r³/3)·(1−cos θ)²(2+cos θ)/sin³θ}, which is {@code 2π r³/3} for a hemisphere (θ = 90°).
     *
     * @param atoms           atoms in the droplet; positive
     * @param atomsPerNm3     atomic number density of the liquid in nm^-3; positive
     * @param contactAngleDeg contact angle in degrees, strictly between 0 and 180
     * @return the base radius in nm
     */
    static double capBaseRadiusNm(double atoms, double atomsPerNm3, double contactAngleDeg) {
        double volume = atoms / atomsPerNm3;
        double t = Math.toRadians(contactAngleDeg);
        double c = Math.cos(t);
        double s = Math.sin(t);
        double shape = (1 - c) * (1 - c) * (2 + c) / (s * s * s);
        return Math.cbrt(3 * volume / (Math.PI * shape));
    }

    /**
     * Checks that every parameter value lies inside its declared bounds.
     *
     * @param parameters the model's parameter definitions
     * @param values     the values passed to predict
     * @return a reason when a value is missing or outside its bounds, empty when all are fine
     */
    static Optional<String> outOfBounds(List<ModelParameter> parameters, ParameterValues values) {
        for (ModelParameter p : parameters) {
            Double v = values.values().get(p.name());
            if (v == null) {
                return Optional.of("no value given for model parameter " + p.name());
            }
            double slack = 1e-9 * Math.max(1.0, Math.max(Math.abs(p.min()), Math.abs(p.max())));
            if (v < p.min() - slack || v > p.max() + slack) {
                return Optional.of(String.format(Locale.ROOT, "model parameter %s = %s is outside its range [%s, %s]",
                        p.name(), v, p.min(), p.max()));
            }
        }
        return Optional.empty();
    }

    /**
     * Formats a temperature for a grower.
     *
     * @param kelvin a temperature in K
     * @return for example {@code "156.6 °C"}
     */
    static String celsius(double kelvin) {
        return String.format(Locale.ROOT, "%.1f °C", kelvin - ZERO_CELSIUS_K);
    }

    /**
     * Formats a number with three significant digits.
     *
     * @param value any finite number
     * @return the formatted number
     */
    static String sig3(double value) {
        if (!Double.isFinite(value) || value == 0) {
            return String.format(Locale.ROOT, "%.3g", value);
        }
        // the same text as String.format(Locale.ROOT, "%.3g", value) (java.util.Formatter: the shortest
        // decimal of the double rounded half-up to 3 digits; plain notation for 1e-4 <= |m| < 1e3, else
        // d.dde+XX) at a fraction of its cost: the models call this on every prediction of a fit
        double a = Math.abs(value);
        int exponent = (int) Math.floor(Math.log10(a));
        double scaled = scaledTo3Digits(a, exponent);
        if (scaled < 100) {
            scaled = scaledTo3Digits(a, --exponent);
        } else if (scaled >= 1000) {
            scaled = scaledTo3Digits(a, ++exponent);
        }
        double frac = scaled - Math.floor(scaled);
        String digits;
        if (Math.abs(frac - 0.5) < 1e-6 || Math.abs(exponent) > 20 || !(scaled >= 100 && scaled < 1000)) {
            // near a rounding tie (or far out) the double arithmetic may differ from the decimal rounding
            java.math.BigDecimal m = new java.math.BigDecimal(Double.toString(a))
                    .round(new java.math.MathContext(3, java.math.RoundingMode.HALF_UP));
            exponent = m.precision() - m.scale() - 1;
            digits = (m.unscaledValue().toString() + "00").substring(0, 3);
        } else {
            long r = Math.round(scaled);
            if (r == 1000) {
                r = 100;
                exponent++;
            }
            digits = Long.toString(r);
        }
        StringBuilder sb = new StringBuilder(12);
        if (value < 0) {
            sb.append('-');
        }
        if (exponent >= -4 && exponent < 3) {
            if (exponent >= 0) {
                sb.append(digits, 0, exponent + 1);
                if (exponent < 2) {
                    sb.append('.').append(digits, exponent + 1, 3);
                }
            } else {
                sb.append("0.");
                for (int i = -1; i > exponent; i--) {
                    sb.append('0');
                }
                sb.append(digits);
            }
        } else {
            sb.append(digits.charAt(0)).append('.').append(digits, 1, 3).append('e').append(exponent < 0 ? '-' : '+');
            int ae = Math.abs(exponent);
            if (ae < 10) {
                sb.append('0');
            }
            sb.append(ae);
        }
        return sb.toString();
    }

    /** {@code a / 10^(exponent - 2)}, dividing or multiplying by an exact power of ten. */
    private static double scaledTo3Digits(double a, int exponent) {
        int k = exponent - 2;
        return k >= 0 ? a / Math.pow(10, k) : a * Math.pow(10, -k);
    }

    /**
     * The melting-point guard: a reason when the deposit metal is solid at the given temperature. Below the
     * melting point a droplet is still taken as a supercooled liquid down to the surface's
     * {@linkplain Surface#supercoolingLimitK() supercooling limit} (see {@link #supercooledNote}); below that
     * limit, or below the melting point when no margin is known, the deposit is solid.
     *
     * @param surface      the growth surface
     * @param temperatureK the temperature of the step that assumes liquid droplets
     * @param what         what does not apply, for example {@code "liquid-droplet scaling"}
     * @return a reason when the deposit is known and solid, empty otherwise
     */
    static Optional<String> solidDeposit(Surface surface, double temperatureK, String what) {
        if (surface.depositMetal().isEmpty() || surface.meltingPointK().isEmpty()) {
            return Optional.empty();
        }
        double melt = surface.meltingPointK().getAsDouble();
        double limit = liquidLimitK(surface);
        if (temperatureK >= limit) {
            return Optional.empty();
        }
        String metal = surface.depositMetal().get();
        String bound = limit < melt
                ? "below its supercooling limit of " + celsius(limit) + " (melting point " + celsius(melt) + ")"
                : "below its melting point of " + celsius(melt) + " (no supercooling margin is known for " + metal + ")";
        return Optional.of(metal + " is solid " + bound + "; recipe: " + celsius(temperatureK) + ", outside the validity of "
                + what + ", which assumes liquid droplets");
    }

    /**
     * A note when the deposit is below its melting point but within its supercooling margin, so it is taken as
     * a supercooled liquid.
     *
     * @param surface      the growth surface
     * @param temperatureK the temperature of the step that assumes liquid droplets
     * @return the note, empty when the deposit is above its melting point, solid, or unknown
     */
    static Optional<String> supercooledNote(Surface surface, double temperatureK) {
        if (surface.depositMetal().isEmpty() || surface.meltingPointK().isEmpty()) {
            return Optional.empty();
        }
        double melt = surface.meltingPointK().getAsDouble();
        if (temperatureK >= melt || temperatureK < liquidLimitK(surface)) {
            return Optional.empty();
        }
        return Optional.of(surface.depositMetal().get() + " at " + celsius(temperatureK) + " is below its melting point ("
                + celsius(melt) + ") and taken as a supercooled liquid (supercooling limit "
                + celsius(liquidLimitK(surface)) + ")");
    }

    private static double liquidLimitK(Surface surface) {
        double melt = surface.meltingPointK().getAsDouble();
        return Math.min(melt, surface.supercoolingLimitK().orElse(melt));
    }
}
