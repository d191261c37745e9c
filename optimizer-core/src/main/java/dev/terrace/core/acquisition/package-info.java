/**
 * Acquisition functions that turn a surrogate's predictive distribution into a score for a
 * candidate recipe: expected improvement and its stable logarithm, probability of improvement,
 * target-window probabilities with Terrace's optimistic (exploring) variant, and constrained
 * expected improvement ({@link dev.terrace.core.acquisition.Acquisitions}), on top of an accurate
 * standard normal ({@link dev.terrace.core.acquisition.StandardNormal}).
 */
package dev.terrace.core.acquisition;
