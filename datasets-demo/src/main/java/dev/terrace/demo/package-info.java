/**
 * Terrace's demo material: the bundled demo campaign, and a virtual chamber that makes
 * <strong>invented</strong> growth runs for the demo, the tests and the benchmarks.
 *
 * <p>Nothing in this package is a measurement. {@link dev.terrace.demo.VirtualChamber} grows
 * recipes against a made-up {@link dev.terrace.demo.Truth}; {@link dev.terrace.demo.GrowerDesign}
 * plans the kind of hand-made series a grower starts a campaign with; and
 * {@link dev.terrace.demo.DemoLogWriter} writes the results as a run log whose first line says the
 * data are invented. {@link dev.terrace.demo.RegenerateDemo} rebuilds the bundled demo log.
 *
 * @since 0.1
 */
package dev.terrace.demo;
