package dev.terrace.cli.report;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.File;
import java.io.IOException;
import java.util.Locale;

/**
 * Says whether a screenshot shows anything: the share of pixels that are not (nearly) white.
 * Run by {@code .ci/run} on Chromium's screenshot of the demo report, as a single-file program:
 * {@code java -Djava.awt.headless=true ScreenshotInk.java shot.png}; exits 0 when more than
 * {@link #MIN_INK_SHARE} of the pixels carry ink, 1 when the page is blank, 2 when the file cannot
 * be read.
 */
public final class ScreenshotInk {

    /** A pixel with every channel at or above this (of 255) counts as white paper. */
    public static final int WHITE_LEVEL = 250;
    /** Share of inked pixels above which a page is not blank: 1 % (a page of text inks far more). */
    public static final double MIN_INK_SHARE = 0.01;

    private ScreenshotInk() {
    }

    /**
     * @param img an image
     * @return the share of its pixels that are not white, 0 to 1
     */
    public static double inkShare(BufferedImage img) {
        long ink = 0;
        long all = (long) img.getWidth() * img.getHeight();
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int rgb = img.getRGB(x, y);
                int a = (rgb >>> 24) & 0xff;
                int r = (rgb >> 16) & 0xff;
                int g = (rgb >> 8) & 0xff;
                int b = rgb & 0xff;
                boolean white = a == 0 || (r >= WHITE_LEVEL && g >= WHITE_LEVEL && b >= WHITE_LEVEL);
                if (!white) {
                    ink++;
                }
            }
        }
        return all == 0 ? 0 : (double) ink / all;
    }

    /**
     * @param args the PNG file
     * @throws IOException never in practice (read failures exit with code 2)
     */
    public static void main(String[] args) throws IOException {
        if (args.length != 1) {
            System.err.println("usage: java ScreenshotInk.java FILE.png");
            System.exit(2);
        }
        BufferedImage img;
        try {
            img = ImageIO.read(new File(args[0]));
        } catch (IOException e) {
            img = null;
        }
        if (img == null) {
            System.err.println("screenshot check: cannot read " + args[0] + " as an image");
            System.exit(2);
        }
        double share = inkShare(img);
        boolean ok = share > MIN_INK_SHARE;
        System.out.println(String.format(Locale.ROOT, "screenshot check: %dx%d, %.2f %% of the pixels carry ink (%s)",
                img.getWidth(), img.getHeight(), 100 * share, ok ? "not blank" : "BLANK"));
        System.exit(ok ? 0 : 1);
    }
}
