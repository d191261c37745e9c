package dev.terrace.core.fit;

import dev.terrace.spi.ModelParameter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The fit of one combination of discrete choices (mutable while it is fitted). */
final class CandidateFit {
    Map<String, Double> combo;
    List<ModelParameter> free = new ArrayList<>();
    Map<String, String> heldReason = new LinkedHashMap<>();
    double[] u;
    double aicc;
    double m2ll;
    int k;
    Map<String, Double> sigma = new LinkedHashMap<>();
    /** True when the check at the fitted values changed which parameters are free. */
    boolean freeSetChanged;
}
