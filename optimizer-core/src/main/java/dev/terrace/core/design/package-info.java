/**
 * Space-filling starting designs: maximin Latin hypercubes with balanced categorical levels
 * ({@link dev.terrace.core.design.LatinHypercube}).
 */
package dev.terrace.core.design;
