package dev.terrace.core.window;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

/**
 * A small synthetic campaign for the window and front tests. INVENTED DATA: the scenario (a film
 * grown at a substrate temperature, then annealed) and every run come from a made-up smooth
 * function with noise, not from a lab. No growth models (a pure GP surrogate).
 */
final class WindowFixtures {

    static final String YAML = String.join("\n",
            "# INVENTED test campaign: made-up numbers, not measurements",
            "campaign: window-test",
            "material: {substrate: GaAs}",
            "parameters:",
            "  t_sub:    {unit: degC, min: 400, max: 600, role: substrate_temperature}",
            "  t_anneal: {unit: degC, min: 400, max: 650, role: anneal_temperature}",
            "  amount:   {unit: ML, min: 1, max: 5, role: coverage}",
            "  rate:     {unit: ML/s, min: 0.05, max: 1, scale: log, role: deposition_rate}",
            "  bep:      {unit: Torr, min: 1.0e-7, max: 1.0e-5, scale: log, role: group_v_bep}",
            "  cell:     {choices: [a, b]}",
            "outcomes:",
            "  size: {unit: nm}",
            "  mode: {classes: [flat, rough]}",
            "targets:",
            "  size: {min: 20, max: 30}",
            "  mode: {is: flat}",
            "limits:",
            "  - t_anneal >= t_sub - 50",
            "models: []",
            "runs: runs.csv",
            "");

    /** A held recipe in the middle of the box. */
    static final Map<String, Object> MIDDLE = Map.of("t_sub", 500.0, "t_anneal", 540.0, "amount", 3.0,
            "rate", 0.2, "bep", 1.0e-6, "cell", "a");

    private WindowFixtures() {
    }

    /** The invented truth: size peaks near t_sub = 500 degC; the film is flat for anneals of 470-610 degC. */
    static double size(double tSub, double amount) {
        return 15 + 12 * Math.exp(-Math.pow((tSub - 500) / 70, 2)) + 2 * (amount - 3);
    }

    static LoadedCampaign campaign() throws Exception {
        Campaign c = CampaignReader.parse(Path.of("/virtual/window-test/campaign.yaml"), new StringReader(YAML), null)
                .campaign();
        Random r = new Random(20260305L);
        StringBuilder csv = new StringBuilder("run_id,t_sub,t_anneal,amount,rate,bep,cell,size,mode,status\n");
        int k = 0;
        while (k < 36) {
            double tSub = 400 + 200 * r.nextDouble();
            double tAnn = 400 + 250 * r.nextDouble();
            if (tAnn < tSub - 50) {
                continue;
            }
            double amount = 1 + 4 * r.nextDouble();
            double rate = 0.05 * Math.pow(20, r.nextDouble());
            double bep = 1e-7 * Math.pow(100, r.nextDouble());
            String cell = r.nextBoolean() ? "a" : "b";
            double s = size(tSub, amount) + 0.5 * r.nextGaussian();
            String mode = tAnn > 470 + 10 * r.nextGaussian() && tAnn < 610 + 10 * r.nextGaussian() ? "flat" : "rough";
            csv.append(String.format(Locale.ROOT, "W%02d,%.1f,%.1f,%.2f,%.4g,%.3g,%s,%.2f,%s,ok%n", k, tSub, tAnn,
                    amount, rate, bep, cell, s, mode));
            k++;
        }
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new LoadedCampaign(c, log, List.of());
    }

    static CampaignSurrogate surrogate() throws Exception {
        return CampaignSurrogate.build(campaign(), PluginRegistry.builder().autoDiscovery(false).build(), false, 11);
    }

    static Map<String, Object> middle() {
        Map<String, Object> m = new LinkedHashMap<>();
        for (String k : List.of("t_sub", "t_anneal", "amount", "rate", "bep", "cell")) {
            m.put(k, MIDDLE.get(k));
        }
        return m;
    }
}
