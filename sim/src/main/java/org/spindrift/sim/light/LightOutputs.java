package org.spindrift.sim.light;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.FitsException;
import nom.tam.fits.Header;
import org.spindrift.shared.Version;
import org.spindrift.shared.archive.ArchiveColumns;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.AtomicFiles;

/**
 * Writes the light stage's files into a run folder (DEVELOPERS.md, run archive layout):
 * {@code centroid.csv}, {@code lightcurve.csv}, {@code mock_astrometry.csv} (when noise is asked)
 * and {@code images.fits}, each through a temporary name.
 *
 * <p>The FITS cube is the primary HDU, float32, axes (x, y, time) = (NAXIS1, NAXIS2, NAXIS3), with
 * a celestial WCS in offset coordinates: the scenario has no sky position, so the pair is not
 * equatorial but a generic longitude/latitude pair {@code OFLN-TAN / OFLT-TAN} ("xxLN/xxLT", FITS
 * WCS Paper II, Calabretta &amp; Greisen 2002, A&amp;A 395, 1077, sec. 2; astropy.wcs reads it
 * as celestial), named by WCSNAME, with no RADESYS or EQUINOX; CRVAL (0, 0) is the black hole,
 * CRPIX at the hole, CDELT in degrees with CDELT1 &lt; 0 (offset towards east to the left), and
 * a linear time axis (CTYPE3 TIME, minutes of observer time; Rots et al. 2015, A&amp;A 574, A36).
 */
public final class LightOutputs {
    /** WCSNAME of the image cube: offsets from the black hole, no absolute sky position. */
    public static final String OFFSET_FRAME = "offset from black hole";
    /** CTYPE1 of the image cube: generic offset longitude (east), gnomonic projection. */
    public static final String OFFSET_CTYPE1 = "OFLN-TAN";
    /** CTYPE2 of the image cube: generic offset latitude (north), gnomonic projection. */
    public static final String OFFSET_CTYPE2 = "OFLT-TAN";
    /** Header card of the position angle of the projected spin axis (distinct from the beam's BPA). */
    public static final String SPIN_PA_CARD = "SPINPA";

    /** Header of centroid.csv. */
    public static final String CENTROID_HEADER = ArchiveColumns.header(ArchiveColumns.CENTROID);
    /** Header of lightcurve.csv. */
    public static final String LIGHTCURVE_HEADER = ArchiveColumns.header(ArchiveColumns.LIGHTCURVE);
    /** Header of mock_astrometry.csv. */
    public static final String MOCK_HEADER = ArchiveColumns.header(ArchiveColumns.MOCK_ASTROMETRY);

    private LightOutputs() {
    }

    /** Where files go: the run folder's writer (temporary name, rename, registered for the manifest). */
    @FunctionalInterface
    public interface Sink {
        void write(String relativeName, AtomicFiles.StreamWriter writer) throws IOException;
    }

    /** @return a sink writing into a plain folder through {@link AtomicFiles} */
    public static Sink folder(Path folder) {
        return (name, w) -> {
            Path target = folder.resolve(name);
            Files.createDirectories(target.getParent());
            AtomicFiles.writeStream(target, w);
        };
    }

    /** @return the names of the files written (relative to the run folder) */
    public static List<String> write(Sink out, LightResult r) throws IOException {
        List<String> names = new ArrayList<>();
        LightSettings s = r.settings();
        double uas = s.uasPerM();
        double min = s.minutesPerM();
        double[] t = r.timesM();
        out.write(ArchiveLayout.CENTROID, os -> {
            try (BufferedWriter w = text(os)) {
                w.write(CENTROID_HEADER);
                w.newLine();
                for (int f = 0; f < t.length; f++) {
                    FrameMoments m = r.moments().get(f);
                    w.write(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,%.6f,%.8e,%.6f,%.6f,%.6f,%.6f,%.6f",
                            t[f] * min, t[f], m.x() * uas, m.y() * uas, m.flux(), r.steadyX()[f] * uas,
                            r.steadyY()[f] * uas, m.xx() * uas * uas, m.yy() * uas * uas, m.xy() * uas * uas));
                    w.newLine();
                }
            }
        });
        names.add(ArchiveLayout.CENTROID);
        double mean = 0;
        for (FrameMoments m : r.moments()) {
            mean += m.flux() / t.length;
        }
        final double meanFlux = mean;
        out.write(ArchiveLayout.LIGHTCURVE, os -> {
            try (BufferedWriter w = text(os)) {
                w.write(LIGHTCURVE_HEADER);
                w.newLine();
                for (int f = 0; f < t.length; f++) {
                    double fl = r.moments().get(f).flux();
                    w.write(String.format(Locale.ROOT, "%.6f,%.6f,%.8e,%.8e,%.6f", t[f] * min, t[f], fl,
                            fl + r.steadyFlux(), meanFlux > 0 ? fl / meanFlux : 0.0));
                    w.newLine();
                }
            }
        });
        names.add(ArchiveLayout.LIGHTCURVE);
        if (r.mock() != null) {
            LightResult.MockAstrometry mk = r.mock();
            out.write(ArchiveLayout.MOCK_ASTROMETRY, os -> {
                try (BufferedWriter w = text(os)) {
                    w.write(MOCK_HEADER);
                    w.newLine();
                    for (int i = 0; i < mk.timesM().length; i++) {
                        w.write(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,%.6f,%.6f", mk.timesM()[i] * min,
                                mk.timesM()[i], mk.x()[i] * uas, mk.y()[i] * uas, mk.sigmaUas()));
                        w.newLine();
                    }
                }
            });
            names.add(ArchiveLayout.MOCK_ASTROMETRY);
        }
        out.write(ArchiveLayout.IMAGES, os -> writeFits(os, r));
        names.add(ArchiveLayout.IMAGES);
        return names;
    }

    private static BufferedWriter text(java.io.OutputStream os) {
        return new BufferedWriter(new java.io.OutputStreamWriter(os, StandardCharsets.UTF_8));
    }

    private static void writeFits(java.io.OutputStream os, LightResult r) throws IOException {
        LightSettings s = r.settings();
        int n = r.camera().pixels();
        int frames = r.images().length;
        float[][][] cube = new float[frames][n][n];
        for (int f = 0; f < frames; f++) {
            for (int row = 0; row < n; row++) {
                System.arraycopy(r.images()[f], row * n, cube[f][row], 0, n);
            }
        }
        double pixDeg = r.camera().pixelSize() * s.uasPerM() / 3.6e9;
        double t0 = r.timesM().length > 0 ? r.timesM()[0] * s.minutesPerM() : 0.0;
        double dt = r.timesM().length > 1 ? (r.timesM()[1] - r.timesM()[0]) * s.minutesPerM() : 1.0;
        try (Fits fits = new Fits()) {
            BasicHDU<?> hdu = Fits.makeHDU(cube);
            Header h = hdu.getHeader();
            nom.tam.fits.HeaderCard simple = h.findCard("SIMPLE");
            if (simple != null) {
                simple.setComment("conforms to FITS standard");   // no write time: files reproducible
            }
            h.addValue("BUNIT", "", "relative intensity (arbitrary units, see COMMENT)");
            h.addValue("WCSAXES", 3, "sky offsets and observer time");
            h.addValue("WCSNAME", OFFSET_FRAME, "no sky position: offsets from the black hole");
            h.addValue("CTYPE1", OFFSET_CTYPE1, "east offset from the black hole (CRVAL = 0,0)");
            h.addValue("CTYPE2", OFFSET_CTYPE2, "north offset from the black hole");
            h.addValue("CTYPE3", "TIME", "observer time");
            h.addValue("CUNIT1", ArchiveLayout.IMAGE_SKY_UNIT, "");
            h.addValue("CUNIT2", ArchiveLayout.IMAGE_SKY_UNIT, "");
            h.addValue("CUNIT3", ArchiveLayout.IMAGE_TIME_UNIT, "");
            h.addValue("CRPIX1", 0.5 * (n + 1), "black hole at the image centre");
            h.addValue("CRPIX2", 0.5 * (n + 1), "black hole at the image centre");
            h.addValue("CRPIX3", 1.0, "");
            h.addValue("CRVAL1", 0.0, "");
            h.addValue("CRVAL2", 0.0, "");
            h.addValue("CRVAL3", t0, "observer time of the first frame, min");
            h.addValue("CDELT1", -pixDeg, "east to the left");
            h.addValue("CDELT2", pixDeg, "north up");
            h.addValue("CDELT3", dt, "frame cadence, min");
            if (s.beamFwhmUas() > 0) {
                double b = s.beamFwhmUas() / 3.6e9;
                h.addValue("BMAJ", b, "Gaussian beam FWHM, deg");
                h.addValue("BMIN", b, "Gaussian beam FWHM, deg");
                h.addValue("BPA", 0.0, "");
            }
            h.addValue("PIXUAS", r.camera().pixelSize() * s.uasPerM(), "pixel size, micro-arcseconds");
            h.addValue("PIXM", r.camera().pixelSize(), "pixel size, M");
            h.addValue("TMIN_M", r.timesM().length > 0 ? r.timesM()[0] : 0.0, "observer time of frame 1, M");
            h.addValue("DT_M", r.timesM().length > 1 ? r.timesM()[1] - r.timesM()[0] : 0.0, "cadence, M");
            h.addValue("INCL", s.inclinationDeg(), "inclination, deg");
            h.addValue(SPIN_PA_CARD, s.positionAngleDeg(), "spin axis on the sky, deg N through E (not BPA)");
            h.addValue("LENSING", s.lensing(), "ray traced (T) or straight lines (F)");
            h.addValue("ORIGIN", "spindrift " + Version.get(), "");
            h.insertComment("Intensity I = integral g^(2+alpha) rho dlambda in arbitrary units; frame flux");
            h.insertComment("= sum of pixels times pixel area in M^2 (lightcurve.csv). Time origin: see");
            h.insertComment("centroid.csv / README (observer time = emission time + ray delay).");
            fits.addHDU(hdu);
            nom.tam.util.FitsOutputStream fo = new nom.tam.util.FitsOutputStream(os);
            fits.write(fo);
            fo.flush();
        } catch (FitsException e) {
            throw new IOException("writing " + ArchiveLayout.IMAGES + ": " + e.getMessage(), e);
        }
    }
}
