/**
 * Beam fluxes and growth-rate calibration: beam species ({@link dev.terrace.core.flux.Species}),
 * ion-gauge sensitivity ({@link dev.terrace.core.flux.IonGauge}), flux ratios and rough absolute
 * fluxes from beam-equivalent pressures ({@link dev.terrace.core.flux.BeamFlux}) and growth rates
 * from RHEED oscillations ({@link dev.terrace.core.flux.RheedCalibration}).
 */
package dev.terrace.core.flux;
