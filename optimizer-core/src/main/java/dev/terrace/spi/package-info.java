/**
 * The service-provider interface: what a growth-model plugin implements ({@link dev.terrace.spi.GrowthModel})
 * and the value types it exchanges with the core. Plugins depend on this package only.
 */
package dev.terrace.spi;
