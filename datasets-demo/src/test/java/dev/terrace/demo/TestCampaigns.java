package dev.terrace.demo;

import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;

import java.io.StringReader;
import java.nio.file.Path;

/** Campaigns invented for the chamber tests. */
final class TestCampaigns {

    /** A droplet campaign with wide boxes, every droplet role, a setting and an outcome without role. */
    static final String DROPLETS = String.join("\n",
            "campaign: chamber-test",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t_sub:   {unit: degC, min: 100, max: 700, role: substrate_temperature}",
            "  amount:  {unit: ML, min: 0.5, max: 10, role: coverage}",
            "  rate:    {unit: ML/s, min: 0.01, max: 1, scale: log, role: deposition_rate}",
            "  bep:     {unit: Torr, min: 1.0e-9, max: 1.0e-4, scale: log, role: group_v_bep}",
            "  t_cr:    {unit: degC, min: 100, max: 700, role: crystallization_temperature}",
            "  anneal:  {unit: s, min: 0, max: 600, role: anneal_time}",
            "  cracker: {choices: [As2, As4], role: group_v_species}",
            "  operator: {choices: [anna, ben]}",
            "outcomes:",
            "  density:  {unit: cm^-2, scale: log, role: island_density}",
            "  diameter: {unit: nm, role: island_diameter}",
            "  height:   {unit: nm, role: island_height}",
            "  shape:    {classes: [dot, ring, disk, hole], role: morphology}",
            "  pl_peak:  {unit: nm}",
            "");

    /** The same droplet physics in other units: K, mbar, um^-2 and um. */
    static final String DROPLETS_OTHER_UNITS = String.join("\n",
            "campaign: chamber-units",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t_sub:   {unit: K, min: 373.15, max: 973.15, role: substrate_temperature}",
            "  amount:  {unit: ML, min: 0.5, max: 10, role: coverage}",
            "  rate:    {unit: ML/s, min: 0.01, max: 1, scale: log, role: deposition_rate}",
            "  bep:     {unit: mbar, min: 1.0e-9, max: 1.0e-4, scale: log, role: group_v_bep}",
            "outcomes:",
            "  density:  {unit: um^-2, scale: log, role: island_density}",
            "  diameter: {unit: um, role: island_diameter}",
            "");

    /** A droplet campaign declaring one class the chamber models and one it does not. */
    static final String FEW_CLASSES = String.join("\n",
            "campaign: chamber-classes",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t_sub: {unit: degC, min: 100, max: 700, role: substrate_temperature}",
            "  bep:   {unit: Torr, min: 1.0e-9, max: 1.0e-4, scale: log, role: group_v_bep}",
            "outcomes:",
            "  shape: {classes: [pyramid, ring], role: morphology}",
            "  mode:  {classes: [step-flow, islands], role: growth_mode}",
            "");

    /** A film campaign on vicinal GaAs(001). */
    static final String FILM = String.join("\n",
            "campaign: film-test",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp:   {unit: degC, min: 400, max: 700, role: substrate_temperature}",
            "  rate:   {unit: ML/s, min: 0.05, max: 2, scale: log, role: deposition_rate}",
            "  bep:    {unit: Torr, min: 1.0e-6, max: 1.0e-4, scale: log, role: group_v_bep}",
            "  miscut: {unit: deg, min: 0, max: 4, role: miscut_angle}",
            "outcomes:",
            "  mode:    {classes: [step-flow, islands, 3d], role: growth_mode}",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "  size:    {unit: nm, role: island_diameter}",
            "");

    private TestCampaigns() {
    }

    static Campaign parse(String yaml) throws InputException {
        return CampaignReader.parse(Path.of("campaign.yaml"), new StringReader(yaml), null).campaign();
    }
}
