/**
 * Surrogate models of the outcomes over the design space.
 *
 * <p>{@link dev.terrace.core.surrogate.GaussianProcess} is the regression surrogate: a Gaussian
 * process with an ARD Matérn-5/2 kernel over the continuous settings times one fitted correlation
 * per categorical setting ({@link dev.terrace.core.surrogate.GpKernel}), fitted around an optional
 * prior mean such as a physics growth model's prediction. Its predictions come as
 * {@link dev.terrace.core.surrogate.Predictive} batches; {@code condition} adds fantasy runs for
 * Kriging-believer batches. {@link dev.terrace.core.surrogate.GpSettings} holds the search effort
 * and bounds with their defaults.
 *
 * <p>The GP algebra runs on Smile (GPL-3.0) with native OpenBLAS.
 *
 * @since 0.1
 */
package dev.terrace.core.surrogate;
