package dev.terrace.core.units;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.spi.Quantity;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * eV, meV, %, arcsec and nm heights in the unit table; free unit labels on outcomes without a
 * role; one message, not a cascade, after one bad unit.
 */
class UnitsAddedTest {

    @Test
    void newUnitsConvertByTheirDefinitions() {
        // milli = 1e-3 exactly (SI Brochure, 9th ed. 2019, Table 7: SI prefixes)
        assertEquals(1.2e-3, Units.bySymbol("meV").orElseThrow().toCanonical(1.2, 1), 1e-18);
        assertEquals(Quantity.ENERGY, Units.bySymbol("eV").orElseThrow().quantity());
        assertEquals(1.1, Units.bySymbol("eV").orElseThrow().toCanonical(1.1, 1), 0);
        // 1'' = (1/60)' = (1/3600) degree (SI Brochure, 9th ed. 2019, Table 8: non-SI units accepted for use with the SI)
        assertEquals(1.0, Units.bySymbol("arcsec").orElseThrow().toCanonical(3600, 1), 1e-12);
        assertEquals(Quantity.ANGLE, Units.bySymbol("arcsec").orElseThrow().quantity());
        // % = 0.01 (SI Brochure, 9th ed. 2019, section 5.4.7)
        assertEquals(0.25, Units.bySymbol("%").orElseThrow().toCanonical(25, 1), 1e-15);
        // a height in nm is a length
        assertTrue(Units.forQuantity("nm", Quantity.LENGTH).isPresent());
    }

    static Campaign parse(String yaml) throws InputException {
        return CampaignReader.parse(Path.of("campaign.yaml"), new StringReader(yaml), null).campaign();
    }

    static List<Diagnostic> errors(String yaml) {
        InputException e = assertThrows(InputException.class, () -> parse(yaml));
        return e.diagnostics().stream().filter(Diagnostic::isError).toList();
    }

    static final String HEAD = String.join("\n",
            "campaign: sk-test",
            "material: {substrate: GaAs, deposit: In, group_v: As}",
            "parameters:",
            "  temp: {unit: degC, min: 440, max: 540, role: substrate_temperature}",
            "  rate: {unit: ML/s, min: 0.01, max: 0.2, scale: log, role: deposition_rate}",
            "outcomes:",
            "");

    @Test
    void outcomesWithoutARoleCarryAnyLabelAsWritten() throws Exception {
        Campaign c = parse(HEAD + "  height:  {unit: nm, role: island_height}\n"
                + "  pl_peak: {unit: meV}\n  pl_fwhm: {unit: counts per s}\n  xrd: {unit: arcsec}\n"
                + "targets:\n  pl_fwhm: {max: 40}\n");
        OutcomeSpec label = c.outcome("pl_fwhm").orElseThrow();
        assertEquals("counts per s", label.unit().symbol());
        assertEquals(40, label.unit().toCanonical(40, 1), 0, "a label is never converted");
        assertEquals(Quantity.ENERGY, c.outcome("pl_peak").orElseThrow().unit().quantity());
        assertEquals(Quantity.LENGTH, c.outcome("height").orElseThrow().unit().quantity());
    }

    @Test
    void oneBadUnitGivesOneMessage() {
        // the outcome with a wrong unit for its role is still known to its target
        List<Diagnostic> d = errors(HEAD + "  density: {unit: cm-2, scale: log, role: island_density}\n"
                + "targets:\n  density: {min: 1.0e10, max: 5.0e10}\n");
        assertEquals(1, d.size(), d.toString());
        assertTrue(d.get(0).message().contains("unit 'cm-2' does not fit role quantity areal density"), d.toString());
        // a setting with an unknown unit is still known to the limit that names it
        List<Diagnostic> p = errors(HEAD.replace("outcomes:\n", "  flux: {unit: furlong, min: 1, max: 2}\noutcomes:\n")
                + "  size: {unit: nm, role: island_diameter}\nlimits:\n  - flux <= 2 * rate + 5\n");
        assertEquals(1, p.size(), p.toString());
        assertTrue(p.get(0).message().contains("unknown unit 'furlong'"), p.toString());
    }
}
