package org.spindrift.sim.interferometry;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import nom.tam.fits.BinaryTable;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.FitsException;
import nom.tam.fits.Header;
import nom.tam.fits.RandomGroupsHDU;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.Version;
import org.spindrift.shared.archive.ArchiveColumns;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.sim.light.LightOutputs;

/**
 * Writes the interferometry files into a run folder, each through a temporary name:
 * {@code visibilities.csv}, {@code closure_phases.csv}, {@code closure_amplitudes.csv} and
 * {@code visibilities.uvfits}.
 *
 * <p>The UVFITS file follows the random-groups convention (FITS standard 4.0, section 6; Greisen
 * 2012, AIPS Memo 117 for the parameter and axis names): primary HDU with GROUPS = T, NAXIS1 = 0,
 * axes COMPLEX (real, imaginary, weight = 1/sigma^2), STOKES (I), FREQ, RA, DEC; group parameters
 * UU, VV, WW in seconds (wavelengths / frequency), BASELINE = 256 a1 + a2 (1-based station
 * numbers), DATE (Julian date; the epoch is nominal, see the header comments) and INTTIM (s);
 * then an AIPS AN table with station names and geocentric positions.
 */
public final class InterferometryOutputs {
    /** File names. */
    public static final String VISIBILITIES = ArchiveLayout.VISIBILITIES, CLOSURE_PHASES = ArchiveLayout.CLOSURE_PHASES,
            CLOSURE_AMPLITUDES = ArchiveLayout.CLOSURE_AMPLITUDES, UVFITS = ArchiveLayout.UVFITS;
    /** Header of visibilities.csv. */
    public static final String VIS_HEADER = ArchiveColumns.header(ArchiveColumns.VISIBILITIES);
    /** Header of closure_phases.csv. */
    public static final String CP_HEADER = ArchiveColumns.header(ArchiveColumns.CLOSURE_PHASES);
    /** Header of closure_amplitudes.csv. */
    public static final String CA_HEADER = ArchiveColumns.header(ArchiveColumns.CLOSURE_AMPLITUDES);
    /** Nominal Julian date of observer time zero (2000-01-01 12:00; the array's time is set by the sidereal time). */
    public static final double EPOCH_JD = 2451545.0;

    private InterferometryOutputs() {
    }

    /** @return the names of the files written */
    public static List<String> write(LightOutputs.Sink out, InterferometryResult r) throws IOException {
        List<String> names = new ArrayList<>();
        UvSampling s = r.sampling();
        Observation o = r.observation();
        ArrayGeometry a = r.setup().array();
        double min = r.minutesPerM();
        out.write(VISIBILITIES, os -> {
            try (BufferedWriter w = new BufferedWriter(new OutputStreamWriter(os, StandardCharsets.UTF_8))) {
                w.write(VIS_HEADER);
                w.newLine();
                for (int k = 0; k < s.size(); k++) {
                    double t = s.timesM[s.frame[k]];
                    w.write(String.format(Locale.ROOT, "%.6f,%.6f,%d,%d,%s,%s,%.9e,%.9e,%.9e,%.9e,%.4f,%.4f,%.8e,%.8e,"
                                    + "%.8e,%.4f,%.8e,%.8e,%.8e", t * min, t, s.frame[k], s.scan[k], a.name(s.station1[k]),
                            a.name(s.station2[k]), s.u[k], s.v[k], s.w[k], FastMath.hypot(s.u[k], s.v[k]),
                            FastMath.toDegrees(s.elevation1[k]), FastMath.toDegrees(s.elevation2[k]), o.re()[k],
                            o.im()[k], FastMath.hypot(o.re()[k], o.im()[k]),
                            FastMath.toDegrees(FastMath.atan2(o.im()[k], o.re()[k])), o.sigma()[k], o.modelRe()[k],
                            o.modelIm()[k]));
                    w.newLine();
                }
            }
        });
        names.add(VISIBILITIES);
        out.write(CLOSURE_PHASES, os -> {
            try (BufferedWriter w = new BufferedWriter(new OutputStreamWriter(os, StandardCharsets.UTF_8))) {
                w.write(CP_HEADER);
                w.newLine();
                Closures.Phases p = r.phases();
                for (int k = 0; k < p.size(); k++) {
                    double t = s.timesM[p.frame()[k]];
                    w.write(String.format(Locale.ROOT, "%.6f,%.6f,%d,%s,%s,%s,%.6f,%.6f,%.6f,%s,%s", t * min, t,
                            p.frame()[k], a.name(p.station1()[k]), a.name(p.station2()[k]), a.name(p.station3()[k]),
                            FastMath.toDegrees(p.value()[k]), FastMath.toDegrees(p.sigma()[k]),
                            FastMath.toDegrees(r.modelPhases().value()[k]),
                            r.steadyPhases() == null ? "" : deg(r.steadyPhases().value()[k]),
                            r.steadyPhases() == null ? "" : deg(r.steadyPhases().sigma()[k])));
                    w.newLine();
                }
            }
        });
        names.add(CLOSURE_PHASES);
        out.write(CLOSURE_AMPLITUDES, os -> {
            try (BufferedWriter w = new BufferedWriter(new OutputStreamWriter(os, StandardCharsets.UTF_8))) {
                w.write(CA_HEADER);
                w.newLine();
                Closures.LogAmplitudes c = r.amplitudes();
                Closures.LogAmplitudes st = r.steadyAmplitudes();
                for (int k = 0; k < c.size(); k++) {
                    double t = s.timesM[c.frame()[k]];
                    String n1 = a.name(c.station1()[k]), n2 = a.name(c.station2()[k]), n3 = a.name(c.station3()[k]),
                            n4 = a.name(c.station4()[k]);
                    String num = c.kind()[k] == 0 ? n1 + "-" + n2 + " " + n3 + "-" + n4 : n1 + "-" + n4 + " " + n2 + "-" + n3;
                    String den = n1 + "-" + n3 + " " + n2 + "-" + n4;
                    w.write(String.format(Locale.ROOT, "%.6f,%.6f,%d,%s,%s,%s,%s,%s,%s,%.6f,%.6f,%.6f,%s,%s", t * min, t,
                            c.frame()[k], n1, n2, n3, n4, num, den, c.value()[k], c.sigma()[k],
                            r.modelAmplitudes().value()[k], st == null ? "" : num6(st.value()[k]),
                            st == null ? "" : num6(st.sigma()[k])));
                    w.newLine();
                }
            }
        });
        names.add(CLOSURE_AMPLITUDES);
        if (s.size() > 0) {
            out.write(UVFITS, os -> writeUvfits(os, r));
            names.add(UVFITS);
        }
        return names;
    }

    private static String deg(double rad) {
        return String.format(Locale.ROOT, "%.6f", FastMath.toDegrees(rad));
    }

    private static String num6(double v) {
        return String.format(Locale.ROOT, "%.6f", v);
    }

    /** Writes the random-groups UVFITS file. */
    static void writeUvfits(OutputStream os, InterferometryResult r) throws IOException {
        UvSampling s = r.sampling();
        Observation o = r.observation();
        ObservingSetup setup = r.setup();
        ArrayGeometry a = setup.array();
        double nu = setup.frequencyHz();
        int n = s.size();
        Object[][] rows = new Object[n][];
        for (int k = 0; k < n; k++) {
            double days = s.timesM[s.frame[k]] * setup.secondsPerM() / 86400.0;
            float[] par = {(float) (s.u[k] / nu), (float) (s.v[k] / nu), (float) (s.w[k] / nu),
                (float) (256 * (s.station1[k] + 1) + s.station2[k] + 1), (float) days, (float) setup.integrationS()};
            float[][][][][] data = new float[1][1][1][1][3];
            data[0][0][0][0][0] = (float) o.re()[k];
            data[0][0][0][0][1] = (float) o.im()[k];
            data[0][0][0][0][2] = (float) (1.0 / (o.sigma()[k] * o.sigma()[k]));
            rows[k] = new Object[] {par, data};
        }
        try (Fits fits = new Fits()) {
            RandomGroupsHDU hdu = RandomGroupsHDU.createFrom(rows);
            Header h = hdu.getHeader();
            String[] ptype = {"UU", "VV", "WW", "BASELINE", "DATE", "INTTIM"};
            String[] pcomment = {"u, seconds", "v, seconds", "w, seconds", "256 a1 + a2", "Julian date",
                "integration time, s"};
            for (int p = 0; p < ptype.length; p++) {
                h.addValue("PTYPE" + (p + 1), ptype[p], pcomment[p]);
                h.addValue("PSCAL" + (p + 1), 1.0, "");
                h.addValue("PZERO" + (p + 1), p == 4 ? EPOCH_JD : 0.0, "");
            }
            String[] ctype = {"COMPLEX", "STOKES", "FREQ", "RA", "DEC"};
            double[] crval = {1.0, 1.0, nu, FastMath.toDegrees(setup.rightAscension()),
                FastMath.toDegrees(setup.declination())};
            double[] cdelt = {1.0, 1.0, setup.bandwidthHz(), 1.0, 1.0};
            for (int c = 0; c < ctype.length; c++) {
                h.addValue("CTYPE" + (c + 2), ctype[c], "");
                h.addValue("CRVAL" + (c + 2), crval[c], "");
                h.addValue("CDELT" + (c + 2), cdelt[c], "");
                h.addValue("CRPIX" + (c + 2), 1.0, "");
                h.addValue("CROTA" + (c + 2), 0.0, "");
            }
            h.addValue("OBJECT", r.name().length() > 68 ? r.name().substring(0, 68) : r.name(), "scenario name");
            h.addValue("TELESCOP", "SPINDRIFT", "model visibilities of a simulated array");
            h.addValue("BUNIT", "JY", "");
            h.addValue("EPOCH", 2000.0, "");
            h.addValue("EQUINOX", 2000.0, "");
            h.addValue("DATE-OBS", "2000-01-01", "nominal: observer time zero = JD 2451545.0");
            h.addValue("OBSRA", FastMath.toDegrees(setup.rightAscension()), "");
            h.addValue("OBSDEC", FastMath.toDegrees(setup.declination()), "");
            h.addValue("ORIGIN", "spindrift " + Version.get(), "");
            h.insertComment("Model visibilities with station gains and thermal noise (radiometer equation).");
            h.insertComment("Time: DATE = 2451545.0 + observer time (days); the calendar epoch is nominal,");
            h.insertComment("the hour angle follows the scenario's start_sidereal_time_h.");
            h.insertComment("Sign convention: (u, v, w) of the baseline r(a2) - r(a1) in geocentric X, Y, Z;");
            h.insertComment("V(u, v) = sum I(l, m) exp(-2 pi i (u l + v m)), l east, m north.");
            fits.addHDU(hdu);
            int ns = a.stations();
            String[] anName = new String[ns];
            double[][] xyz = new double[ns][];
            int[] nosta = new int[ns];
            int[] mount = new int[ns];
            float[] offset = new float[ns];
            for (int i = 0; i < ns; i++) {
                anName[i] = a.name(i);
                xyz[i] = a.position(i);
                nosta[i] = i + 1;
            }
            BinaryTable t = BinaryTable.fromColumnMajor(new Object[] {anName, xyz, nosta, mount, offset});
            BinaryTableHDU an = t.toHDU();
            Header ah = an.getHeader();
            String[] col = {"ANNAME", "STABXYZ", "NOSTA", "MNTSTA", "STAXOF"};
            for (int c = 0; c < col.length; c++) {
                ah.addValue("TTYPE" + (c + 1), col[c], "");
            }
            ah.addValue("TUNIT2", "METERS", "");
            ah.addValue("EXTNAME", "AIPS AN", "");
            ah.addValue("EXTVER", 1, "");
            ah.addValue("ARRAYX", 0.0, "");
            ah.addValue("ARRAYY", 0.0, "");
            ah.addValue("ARRAYZ", 0.0, "");
            ah.addValue("FREQ", nu, "");
            ah.addValue("FRAME", "ITRF", "");
            fits.addHDU(an);
            nom.tam.util.FitsOutputStream fo = new nom.tam.util.FitsOutputStream(os);
            fits.write(fo);
            fo.flush();
        } catch (FitsException e) {
            throw new IOException("writing " + UVFITS + ": " + e.getMessage(), e);
        }
    }
}
