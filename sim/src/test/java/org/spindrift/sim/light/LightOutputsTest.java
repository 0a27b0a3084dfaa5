package org.spindrift.sim.light;

import org.spindrift.shared.testing.ExternalPython;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.LightArchive;
import org.spindrift.sim.spacetime.Spacetime;

/** The light files in a run folder, read back by an independent reader (astropy). */
class LightOutputsTest {
    /** Track columns are written with six decimals (%.6f): half a unit of the last one, doubled. */
    private static final double CSV_DIGITS = 1e-5;
    /** Header numbers as FITS stores them (about 15 significant digits) for values of order 1-100. */
    private static final double HEADER_DIGITS = 1e-9;
    /** The same product computed twice in double precision on values of order 1e-9 deg: rounding only. */
    private static final double SAME_FORMULA = 1e-15;
    /** astropy.wcs pixel scales from CDELT in a 32-bit-safe header round trip: 1e-6 relative (our choice). */
    private static final double WCS_REL = 1e-6;
    /** World coordinates of the reference pixel: exactly CRVAL = 0 up to astropy's trigonometry rounding. */
    private static final double WCS_ZERO = 1e-12;

    @TempDir
    Path dir;

    private static LightResult smallRun() {
        Spacetime st = LightTestSupport.kerr(0.3);
        CircularSpotHistory h = new CircularSpotHistory(st, 7.0, 0.0, 0.4, 200, 0.0, 300.0, 100, 1.0, 11L);
        LightSettings s = new LightSettings(50.0, 30.0, 24.0, 40, 3.0, true, 1.0e6, 1.0e-3, 30.0, 0.5, 3.0, 1.0, 3L);
        return LightStage.run(s, st, LightTestSupport.captureRadius(0.3), h, 2);
    }

    @Test
    void filesHaveHeadersAndAstropyReadsTheWcs() throws Exception {
        LightResult r = smallRun();
        List<String> names = LightOutputs.write(LightOutputs.folder(dir), r);
        names.addAll(LightPlots.write(LightOutputs.folder(dir), r));
        for (String n : names) {
            assertTrue(Files.size(dir.resolve(n)) > 0, n);
            String keep = System.getenv("SPINDRIFT_KEEP_TEST_OUTPUT");   // to look at the plots by eye
            if (keep != null) {
                Path to = Path.of(keep).resolve(n);
                Files.createDirectories(to.getParent());
                Files.copy(dir.resolve(n), to, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            }
        }
        // the image frames use the shared sky ramp: empty sky (intensity 0) is its dark end
        java.awt.image.BufferedImage img = javax.imageio.ImageIO.read(dir.resolve("plots/light_images.png").toFile());
        int dark = org.spindrift.shared.colour.ColourRamp.SKY.rgb(0.0);
        int count = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                count += (img.getRGB(x, y) & 0xffffff) == dark ? 1 : 0;
            }
        }
        assertTrue(count > 1000, "pixels of the sky ramp's dark end in light_images.png: " + count);
        List<String> c = Files.readAllLines(dir.resolve("centroid.csv"), StandardCharsets.UTF_8);
        // the header as docs/archive-format.md gives it, spelled out (not taken from the writer's constants)
        assertEquals("t_obs_min,t_obs_M,x_uas,y_uas,flux,x_with_steady_uas,y_with_steady_uas,sigma_xx_uas2,"
                + "sigma_yy_uas2,sigma_xy_uas2", c.get(0));
        assertEquals(r.timesM().length + 1, c.size());
        assertTrue(Files.exists(dir.resolve("mock_astrometry.csv")), "noise asked: mock data written");
        try (var s = Files.list(dir)) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().endsWith(".partial")), "no partial files left");
        }

        // no write time in the FITS header (the library's default SIMPLE comment carries one), so
        // the same run gives the same bytes
        byte[] head = java.util.Arrays.copyOf(Files.readAllBytes(dir.resolve("images.fits")), 80);
        String card = new String(head, StandardCharsets.US_ASCII);
        assertTrue(card.startsWith("SIMPLE") && card.contains("conforms to FITS standard"), card);
        // the shared reader (for the viewer) gets back what was written
        LightArchive.Track tr = LightArchive.readTrack(dir);
        assertEquals(r.timesM().length, tr.size());
        int mid = tr.size() / 2;
        assertEquals(r.moments().get(mid).x() * r.settings().uasPerM(), tr.x()[mid], CSV_DIGITS);
        assertEquals(r.steadyY()[mid] * r.settings().uasPerM(), tr.ySteady()[mid], CSV_DIGITS);
        LightArchive.Cube cube = LightArchive.readCube(dir);
        assertEquals(r.images().length, cube.frames().length);
        assertEquals(r.camera().pixels(), cube.pixels());
        assertEquals(r.images()[mid][5 * r.camera().pixels() + 7], cube.frames()[mid][5][7]);
        assertEquals(r.camera().pixelSize() * r.settings().uasPerM(), cube.pixelUas(), HEADER_DIGITS);
        assertEquals(30.0, cube.beamFwhmUas(), HEADER_DIGITS);

        double pixDeg = r.camera().pixelSize() * r.settings().uasPerM() / 3.6e9;
        String py = String.join("\n",
                "import sys",
                "from astropy.io import fits",
                "from astropy.wcs import WCS",
                "from astropy.wcs.utils import proj_plane_pixel_scales",
                "h = fits.open(sys.argv[1])[0]",
                "w = WCS(h.header)",
                "c = w.celestial",
                "s = proj_plane_pixel_scales(c)",
                "ra, dec = c.wcs_pix2world([[(h.header['NAXIS1'] - 1) / 2.0, (h.header['NAXIS2'] - 1) / 2.0]], 0)[0]",
                "print(w.naxis, h.data.shape[0], s[0], s[1], c.wcs.cdelt[0], ra, dec, w.wcs.ctype[2],",
                "      'RADESYS' in h.header, 'EQUINOX' in h.header, 'PA' in h.header, h.header['SPINPA'],",
                "      w.wcs.name.replace(' ', '_'), w.has_celestial)");
        String exe = ExternalPython.require("astropy.wcs", "python3-astropy");
        List<String> lines = ExternalPython.run(exe, py, dir.resolve("images.fits").toString());
        String out = lines.get(lines.size() - 1);
        String[] f = out.trim().split("\\s+");
        assertEquals(3, Integer.parseInt(f[0]), "three WCS axes");
        assertEquals(r.images().length, Integer.parseInt(f[1]), "frames along NAXIS3");
        // pixel scale = field of view / N (astropy.wcs, Debian python3-astropy as independent reader)
        double expected = r.camera().fieldOfView() / r.camera().pixels() * r.settings().uasPerM() / 3.6e9;
        assertEquals(expected, pixDeg, SAME_FORMULA);
        assertEquals(expected, Double.parseDouble(f[2]), WCS_REL * expected, "x pixel scale");
        assertEquals(expected, Double.parseDouble(f[3]), WCS_REL * expected, "y pixel scale");
        assertTrue(Double.parseDouble(f[4]) < 0, "CDELT1 negative: east to the left");
        // image centre maps to the reference point (the black hole), longitude 0 or 360, latitude 0
        double ra = Double.parseDouble(f[5]);
        assertEquals(0.0, Math.min(ra, 360.0 - ra), WCS_ZERO);
        assertEquals(0.0, Double.parseDouble(f[6]), WCS_ZERO);
        assertEquals("TIME", f[7]);
        // offset frame: no equatorial system claimed, named by WCSNAME; spin PA not confusable with BPA
        assertEquals("False", f[8], "no RADESYS");
        assertEquals("False", f[9], "no EQUINOX");
        assertEquals("False", f[10], "no PA card");
        assertEquals(r.settings().positionAngleDeg(), Double.parseDouble(f[11]), HEADER_DIGITS);
        assertEquals(LightOutputs.OFFSET_FRAME.replace(' ', '_'), f[12]);
        assertEquals("True", f[13], "astropy reads the offset pair as celestial");
    }

}
