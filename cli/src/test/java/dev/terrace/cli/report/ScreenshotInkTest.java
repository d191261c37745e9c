package dev.terrace.cli.report;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.imageio.ImageIO;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The blank-page check, on PNG files written and read back by the JDK's own PNG codec (javax.imageio). */
class ScreenshotInkTest {

    static BufferedImage page(boolean withText) {
        BufferedImage img = new BufferedImage(400, 300, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, 400, 300);
        if (withText) {
            g.setColor(Color.BLACK);
            g.fillRect(20, 20, 360, 8); // a heading rule
            g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 28));
            for (int line = 0; line < 6; line++) {
                g.drawString("Runs so far D01 D02 D03", 20, 70 + 36 * line);
            }
        }
        g.dispose();
        return img;
    }

    static BufferedImage roundTrip(BufferedImage img, Path dir, String name) throws Exception {
        Path f = dir.resolve(name);
        ImageIO.write(img, "png", f.toFile());
        return ImageIO.read(f.toFile());
    }

    @Test
    void aWhitePageIsBlank(@TempDir Path tmp) throws Exception {
        assertEquals(0.0, ScreenshotInk.inkShare(roundTrip(page(false), tmp, "white.png")));
    }

    @Test
    void aPageWithTextIsNotBlank(@TempDir Path tmp) throws Exception {
        double share = ScreenshotInk.inkShare(roundTrip(page(true), tmp, "text.png"));
        // the 360 x 8 rule alone is 2880 of 120000 pixels (2.4 %), above the 1 % threshold
        assertTrue(share >= 2880.0 / 120000, "ink share " + share);
        assertTrue(share > ScreenshotInk.MIN_INK_SHARE);
    }

    @Test
    void nearlyWhiteNoiseIsStillBlank() {
        BufferedImage img = page(false);
        img.setRGB(5, 5, new Color(252, 252, 252).getRGB()); // anti-aliasing dust above the white level
        img.setRGB(6, 6, Color.BLACK.getRGB()); // one dark pixel of 120000
        assertEquals(1.0 / 120000, ScreenshotInk.inkShare(img), 1e-12);
        assertTrue(ScreenshotInk.inkShare(img) < ScreenshotInk.MIN_INK_SHARE);
    }
}
