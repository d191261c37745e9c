package dev.terrace.cli;

import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;

/**
 * What a command that reads one campaign takes before its own options: the global options and the
 * CAMPAIGN file as its first positional parameter. A picocli mixin ({@code @Mixin CampaignInput}).
 */
final class CampaignInput {

    @Mixin
    GlobalOptions global = new GlobalOptions();

    @Parameters(index = "0", paramLabel = "CAMPAIGN", description = "The campaign YAML file.")
    Path file;
}
