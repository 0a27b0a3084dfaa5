package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;

/**
 * The samples of a ray table near circular equatorial orbits, binned so that a sheared spot on such
 * an orbit is summed per bin instead of per sample in every frame.
 *
 * <p>On a circular orbit the centre's azimuth is Phi(t_e) = Phi_m + Omega (t_e - t_m) with constant
 * radius, height and 4-velocity, so a sample at azimuth phi with delay d is offset from the centre
 * by phi - Phi(t_o - d) = psi - Theta(t_o), with the sample's own phase psi = phi + Omega d and the
 * frame's Theta(t_o) = Phi_m + Omega (t_o - t_m). Its redshift factor g^(2 + alpha), path length
 * and vertical Gaussian factor do not depend on the frame either.
 *
 * <p>Two levels. The base bins (per table, blob width and orbit height; they do not depend on the
 * orbit's radius or velocity) group the samples of an annulus by cylindrical radius and azimuth,
 * in bins half the blob's standard deviation wide on a fixed grid, and within a bin by delay
 * (groups at most {@link #DELAY_GROUP} M wide: images of different orders fall into different
 * groups); a group keeps its weight (path length x vertical Gaussian), its weighted mean radius,
 * azimuth, delay, photon momenta and sky position. The annulus grows by whole radial bins when an
 * orbit needs more, so a group's content never depends on which orbits came before; the bases of
 * the last few tables are kept (a fit's orbits may alternate between two tables). Per orbit the
 * groups within reach of it get their redshift weight g^(2 + alpha) from their mean photon momenta
 * (g^-1 = -p_mu u^mu is linear in them) and are sorted by phase psi. A frame then weighs each
 * group by the spot's sheared Gaussian at (u, rho (psi - Theta)) and by the envelope at t_o - d,
 * visiting only the phases within the arc's reach: the centroid is the flux-weighted mean of the
 * groups' sky positions. This is a binned form of the per-sample sum (a Riemann sum of the
 * Gaussian at the bins' mean positions), not another model.
 *
 * <p>One instance per thread and source (its buffers are reused; frame sums allocate nothing).
 */
final class RingProfile {
    /** Largest delay spread of one group, M (images of different orders are further apart). */
    static final double DELAY_GROUP = 2.0;
    /** Bin width in units of the blob's standard deviation along the radius (and along the orbit). */
    static final double BIN_SIGMAS = 0.5;
    /** Extra radial margin of the base annulus beyond an orbit's reach when it is (re)built, M. */
    static final double MARGIN = 1.0;
    /** Delay groups per (radius, azimuth) bin (a further sample joins the nearest group). */
    private static final int GROUPS = 6;
    private static final double TWO_PI = 2 * FastMath.PI;
    private static final double INV_TWO_PI_15 = FastMath.pow(2 * FastMath.PI, -1.5);

    // ---- base bins (per table, blob variance, height)
    /** Base bins of one (table, blob variance, height); a few are kept so that orbits alternating between tables do not rebuild them. */
    private static final class Base {
        CompactSourceModel.Index index;
        double aa = Double.NaN, z = Double.NaN;
        /** Radial bin width (M) and the radial bins held [rb0, rb1]; radial bin ir has ceil(2 pi (ir + 1)) azimuth bins. */
        double step;
        int rb0, rb1 = -1;
        /** Groups in radial-bin order, each radial bin's first group (index rbin - rb0) and the end. */
        double[] bw = new double[0], brho = new double[0], bphi = new double[0], bd = new double[0],
                bpr = new double[0], bpth = new double[0], bpph = new double[0], be = new double[0], bn = new double[0];
        int[] rowStart = new int[0];
        int bsize;
        long lastUse;

        boolean same(CompactSourceModel.Index index, double aa, double z) {
            return this.index == index && this.aa == aa && this.z == z;
        }
    }

    /** Base bins kept per instance (least recently used replaced). */
    static final int BASES = 4;
    private final Base[] bases = new Base[BASES];
    private long useClock;

    // ---- the orbit's groups, sorted by phase psi
    /** Weight (base weight x g^(2+alpha)), radial offset from the orbit, phase, delay, east, north. */
    double[] w = new double[0], u = new double[0], psi = new double[0], d = new double[0], east = new double[0],
            north = new double[0];
    int size;
    /** First group of each phase bin (and the end); phase bins about a radial bin wide at the orbit's outer reach. */
    int[] binStart = new int[0];
    private int nPhi;
    private double dPhi;
    /** Orbit constants: cylindrical radius, angular velocity, azimuth at tm, u^t. */
    double rhoC, omega, phiM, tm, ut;

    // ---- scratch
    private double[] sw = new double[0], sr = new double[0], sp = new double[0], sd = new double[0],
            spr = new double[0], spth = new double[0], spph = new double[0], se = new double[0], sn = new double[0];
    private int[] groupCount = new int[0];
    private int[] rowOffset = new int[1];
    private int[] phaseBinOf = new int[0];
    private double[] psiOf = new double[0], gpOf = new double[0];
    private int[] cells = new int[0];

    /** @return the kept base for this table, variance and height, else the least recently used slot (emptied) */
    private Base base(CompactSourceModel.Index index, double aa, double z) {
        Base oldest = null;
        for (int i = 0; i < BASES; i++) {
            if (bases[i] == null) {
                bases[i] = new Base();
            }
            if (bases[i].same(index, aa, z)) {
                return bases[i];
            }
            if (oldest == null || bases[i].lastUse < oldest.lastUse) {
                oldest = bases[i];
            }
        }
        oldest.index = null;
        oldest.rb0 = 0;
        oldest.rb1 = -1;
        return oldest;
    }

    /**
     * Prepares the groups of one orbit.
     *
     * @param aa radial (and vertical) variance of the blob with the kernel, M^2
     * @param box radial and vertical reach of the blob, M
     * @param e 2 + spectral index
     */
    void prepare(CompactSourceModel.Index index, double aa, double box, double rhoC, double zC,
                 double omega, double phiM, double tm, double ut, double ur, double uth, double uph, double e) {
        double st = BIN_SIGMAS * FastMath.sqrt(aa);
        int r0 = FastMath.max(0, (int) FastMath.floor((rhoC - box) / st));
        int r1 = (int) FastMath.floor((rhoC + box) / st);
        // the base's height on a micro-M grid: orbits whose heights differ by integration noise share
        // bins that are bit for bit the same
        double z = FastMath.rint(zC * 1.0e6) * 1.0e-6;
        Base bs = base(index, aa, z);
        if (bs.index == null || r0 < bs.rb0 || r1 > bs.rb1) {
            int m = (int) FastMath.ceil(MARGIN / st);
            int lo = r0 - m, hi = r1 + m;
            if (bs.index != null) {
                lo = FastMath.min(lo, bs.rb0);
                hi = FastMath.max(hi, bs.rb1);
            }
            buildBase(bs, index, aa, z, box, FastMath.max(0, lo), hi);
        }
        bs.lastUse = ++useClock;
        this.rhoC = rhoC;
        this.omega = omega;
        this.phiM = phiM;
        this.tm = tm;
        this.ut = ut;
        nPhi = azimuthBins(r1);
        dPhi = TWO_PI / nPhi;
        double[] bw = bs.bw, brho = bs.brho, bphi = bs.bphi, bd = bs.bd, bpr = bs.bpr, bpth = bs.bpth, bpph = bs.bpph,
                be = bs.be, bn = bs.bn;
        int from = bs.rowStart[r0 - bs.rb0], until = bs.rowStart[r1 - bs.rb0 + 1];
        int n = until - from;
        if (psiOf.length < n) {
            int c = FastMath.max(n, psiOf.length + psiOf.length / 2);
            psiOf = new double[c];
            gpOf = new double[c];
            phaseBinOf = new int[c];
        }
        if (binStart.length < nPhi + 1) {
            binStart = new int[nPhi + 1];
        }
        java.util.Arrays.fill(binStart, 0, nPhi + 1, 0);
        // redshift weight and phase per group; counting sort by phase bin
        int kept = 0;
        for (int j = from; j < until; j++) {
            int t = j - from;
            double gInv = Redshift.inverse(bpr[j], bpth[j], bpph[j], ut, ur, uth, uph);
            if (!(gInv > 0)) {
                phaseBinOf[t] = -1;
                continue;
            }
            gpOf[t] = e == 3.0 ? 1.0 / (gInv * gInv * gInv) : FastMath.pow(gInv, -e);
            double ps = bphi[j] + omega * bd[j];
            ps -= TWO_PI * FastMath.floor(ps / TWO_PI);
            int ip = FastMath.min(nPhi - 1, (int) (ps / dPhi));
            psiOf[t] = ps;
            phaseBinOf[t] = ip;
            binStart[ip + 1]++;
            kept++;
        }
        for (int ip = 0; ip < nPhi; ip++) {
            binStart[ip + 1] += binStart[ip];
        }
        if (w.length < kept) {
            int c = FastMath.max(kept, w.length + w.length / 2);
            w = new double[c];
            u = new double[c];
            psi = new double[c];
            d = new double[c];
            east = new double[c];
            north = new double[c];
        }
        for (int j = from; j < until; j++) {
            int t = j - from;
            int ip = phaseBinOf[t];
            if (ip < 0) {
                continue;
            }
            int at = binStart[ip]++;
            w[at] = bw[j] * gpOf[t];
            u[at] = brho[j] - rhoC;
            psi[at] = psiOf[t];
            d[at] = bd[j];
            east[at] = be[j];
            north[at] = bn[j];
        }
        // binStart[ip] now holds the end of bin ip: shift back to starts
        for (int ip = nPhi; ip > 0; ip--) {
            binStart[ip] = binStart[ip - 1];
        }
        binStart[0] = 0;
        size = kept;
    }

    /** @return the azimuth bins of radial bin ir (of width step): about step wide at its outer edge */
    private static int azimuthBins(int ir) {
        return FastMath.max(8, (int) FastMath.ceil(TWO_PI * (ir + 1)));
    }

    /** @return the number of azimuth (phase) bins */
    int phaseBins() {
        return nPhi;
    }

    /** @return the width of a phase bin, rad */
    double phaseStep() {
        return dPhi;
    }

    /** Bins the samples of radial bins [lo, hi] (of width step) within box of the height zC. */
    private void buildBase(Base bs, CompactSourceModel.Index index, double aa, double zC, double box, int lo, int hi) {
        double step = BIN_SIGMAS * FastMath.sqrt(aa);
        bs.step = step;
        // azimuth bins on a fixed grid per radial bin, as wide as a radial bin at its outer edge
        int nr = hi - lo + 1;
        if (rowOffset.length < nr + 1) {
            rowOffset = new int[nr + 1];
        }
        for (int r = 0; r < nr; r++) {
            rowOffset[r + 1] = rowOffset[r] + azimuthBins(lo + r);
        }
        int bins = rowOffset[nr];
        if (groupCount.length < bins) {
            groupCount = new int[bins];
            int s = bins * GROUPS;
            sw = new double[s];
            sr = new double[s];
            sp = new double[s];
            sd = new double[s];
            spr = new double[s];
            spth = new double[s];
            spph = new double[s];
            se = new double[s];
            sn = new double[s];
        } else {
            java.util.Arrays.fill(groupCount, 0, bins, 0);
        }
        double cutQ = CompactSourceModel.CUT_SIGMAS * CompactSourceModel.CUT_SIGMAS;
        double rLo = lo * step, rHi = (hi + 1) * step;
        int cellCount = listAnnulus(index, 0.5 * (rLo + rHi), 0.5 * (rHi - rLo), zC, box);
        for (int ci = 0; ci < cellCount; ci++) {
            int cellIdx = cells[ci];
            for (int i = index.cellStart[cellIdx], until = index.cellStart[cellIdx + 1]; i < until; i++) {
                int ir = (int) FastMath.floor(index.rho[i] / step);
                double dz = index.z[i] - zC;
                if (ir < lo || ir > hi || FastMath.abs(dz) > box) {
                    continue;
                }
                double qz = dz * dz / aa;
                if (qz >= cutQ) {
                    continue;
                }
                double wi = index.dl[i] * CompactSourceModel.gaussian(0.5 * qz);
                if (!(wi > 0)) {
                    continue;
                }
                double di = index.d[i];
                double ph = FastMath.atan2(index.y[i], index.x[i]);
                ph -= TWO_PI * FastMath.floor(ph / TWO_PI);
                int rowBins = rowOffset[ir - lo + 1] - rowOffset[ir - lo];
                double rowStep = TWO_PI / rowBins;
                int ip = FastMath.min(rowBins - 1, (int) (ph / rowStep));
                int bin = rowOffset[ir - lo] + ip;
                int gc = groupCount[bin];
                // the group whose mean delay is nearest; a new one when none is within DELAY_GROUP / 2
                int best = -1;
                double bestDist = Double.POSITIVE_INFINITY;
                for (int g = 0; g < gc; g++) {
                    int s = bin * GROUPS + g;
                    double dist = FastMath.abs(sd[s] / sw[s] - di);
                    if (dist < bestDist) {
                        bestDist = dist;
                        best = g;
                    }
                }
                if (best < 0 || (bestDist > 0.5 * DELAY_GROUP && gc < GROUPS)) {
                    best = gc;
                    groupCount[bin] = gc + 1;
                    int s = bin * GROUPS + best;
                    sw[s] = 0;
                    sr[s] = 0;
                    sp[s] = 0;
                    sd[s] = 0;
                    spr[s] = 0;
                    spth[s] = 0;
                    spph[s] = 0;
                    se[s] = 0;
                    sn[s] = 0;
                }
                int s = bin * GROUPS + best;
                sw[s] += wi;
                sr[s] += wi * index.rho[i];
                // azimuth relative to the bin's lower edge, so that the mean does not wrap
                sp[s] += wi * (ph - ip * rowStep);
                sd[s] += wi * di;
                spr[s] += wi * index.pr[i];
                spth[s] += wi * index.pth[i];
                spph[s] += wi * index.pph[i];
                se[s] += wi * index.east[i];
                sn[s] += wi * index.north[i];
            }
        }
        int groups = 0;
        for (int b = 0; b < bins; b++) {
            groups += groupCount[b];
        }
        if (bs.bw.length < groups) {
            bs.bw = new double[groups];
            bs.brho = new double[groups];
            bs.bphi = new double[groups];
            bs.bd = new double[groups];
            bs.bpr = new double[groups];
            bs.bpth = new double[groups];
            bs.bpph = new double[groups];
            bs.be = new double[groups];
            bs.bn = new double[groups];
        }
        if (bs.rowStart.length < nr + 1) {
            bs.rowStart = new int[nr + 1];
        }
        bs.bsize = 0;
        for (int r = 0; r < nr; r++) {
            bs.rowStart[r] = bs.bsize;
            int rowBins = rowOffset[r + 1] - rowOffset[r];
            double rowStep = TWO_PI / rowBins;
            for (int ip = 0; ip < rowBins; ip++) {
                int bin = rowOffset[r] + ip;
                for (int g = 0; g < groupCount[bin]; g++) {
                    int s = bin * GROUPS + g;
                    double ws = sw[s];
                    bs.bw[bs.bsize] = ws;
                    bs.brho[bs.bsize] = sr[s] / ws;
                    bs.bphi[bs.bsize] = ip * rowStep + sp[s] / ws;
                    bs.bd[bs.bsize] = sd[s] / ws;
                    bs.bpr[bs.bsize] = spr[s] / ws;
                    bs.bpth[bs.bsize] = spth[s] / ws;
                    bs.bpph[bs.bsize] = spph[s] / ws;
                    bs.be[bs.bsize] = se[s] / ws;
                    bs.bn[bs.bsize] = sn[s] / ws;
                    bs.bsize++;
                }
            }
        }
        bs.rowStart[nr] = bs.bsize;
        bs.index = index;
        bs.aa = aa;
        bs.z = zC;
        bs.rb0 = lo;
        bs.rb1 = hi;
    }

    /**
     * Lists into {@link #cells} the non-empty cells of the index that can hold samples within half
     * (radially) and zBox (vertically) of the circle of cylindrical radius rho at height z.
     *
     * @return the number of cells listed
     */
    private int listAnnulus(CompactSourceModel.Index index, double rho, double half, double z, double zBox) {
        double diag = index.cell * FastMath.sqrt(3.0);
        double reach = rho + half + diag;
        int x0 = index.clamp((int) FastMath.floor((-reach - index.lo) * index.inv));
        int x1 = index.clamp((int) FastMath.floor((reach - index.lo) * index.inv));
        int z0 = index.clamp((int) FastMath.floor((z - zBox - index.lo) * index.inv));
        int z1 = index.clamp((int) FastMath.floor((z + zBox - index.lo) * index.inv));
        int need = (x1 - x0 + 1) * (x1 - x0 + 1) * (z1 - z0 + 1);
        if (cells.length < need) {
            cells = new int[need];
        }
        int count = 0;
        for (int ix = x0; ix <= x1; ix++) {
            double cx = index.lo + (ix + 0.5) * index.cell;
            for (int iy = x0; iy <= x1; iy++) {
                double cy = index.lo + (iy + 0.5) * index.cell;
                double rc = FastMath.sqrt(cx * cx + cy * cy);
                if (FastMath.abs(rc - rho) > half + diag) {
                    continue;
                }
                for (int iz = z0; iz <= z1; iz++) {
                    int cellIdx = (ix * index.n + iy) * index.n + iz;
                    if (index.cellStart[cellIdx + 1] > index.cellStart[cellIdx]) {
                        cells[count++] = cellIdx;
                    }
                }
            }
        }
        return count;
    }

    /**
     * Per emission time on a grid from 0 (step {@link #ampStep}), interleaved: the amplitude
     * weight x envelope / u^t x (2 pi)^(-3/2) / sqrt(det aa) and the inverse covariance of the
     * sheared Gaussian in (u, w): cc / det, bb / det, aa / det.
     */
    private double[] table = new double[0];
    private double ampStep;
    private int ampSize;

    /**
     * Tabulates the spot's emission-time dependence from 0 to tEnd: the amplitude of the
     * emitter-frame density of {@link CompactSourceModel} (without the Gaussian's exponential) and
     * the sheared Gaussian's inverse covariance, linear between grid points a quarter M apart (the
     * envelope is linear between a run's snapshots anyway; the covariance is quadratic in t_e).
     */
    void tabulate(CompactSourceModel.Spot spot, double tEnd, double shearRate, double blob2, double kern2) {
        double aa = blob2 + kern2;
        ampStep = 0.25;
        ampSize = (int) FastMath.ceil(tEnd / ampStep) + 2;
        if (table.length < 4 * ampSize) {
            table = new double[4 * ampSize];
        }
        for (int j = 0; j < ampSize; j++) {
            double te = j * ampStep;
            double sh = shearRate * te;
            double bb = blob2 * sh, cc = blob2 * (1 + sh * sh) + kern2;
            double det = aa * cc - bb * bb;
            // emitter-frame density: weight x envelope / u^t (MTW 1973, sect. 22.3), normalised sheared Gaussian
            table[4 * j] = spot.weight() * spot.flare().applyAsDouble(te) / ut * INV_TWO_PI_15 / FastMath.sqrt(det * aa);
            table[4 * j + 1] = cc / det;
            table[4 * j + 2] = bb / det;
            table[4 * j + 3] = aa / det;
        }
    }

    /**
     * Sums the groups of phase bins [b0, b1] (modulo the bin count) whose emission time t_o - d
     * lies in [e0, e1], for observer time to: sums[0] += flux, sums[1] += flux x east, sums[2] +=
     * flux x north. With pixels non-null each group's value is also handed to it.
     */
    void sum(double to, double e0, double e1, int b0, int b1, double[] sums, PixelSink pixels) {
        double theta = theta(to);
        theta -= TWO_PI * FastMath.floor(theta / TWO_PI);
        double cutQ = CompactSourceModel.CUT_SIGMAS * CompactSourceModel.CUT_SIGMAS;
        double inv = 1.0 / ampStep;
        double[] tb = table;
        int last = ampSize - 2;
        double rho = rhoC, sf = 0, sx = 0, sy = 0;
        for (int b = b0; b <= b1; b++) {
            int bin = b >= nPhi ? b - nPhi : b;
            for (int j = binStart[bin], n = binStart[bin + 1]; j < n; j++) {
                double te = to - d[j];
                if (te < e0 || te > e1) {
                    continue;
                }
                double dphi = psi[j] - theta;
                if (dphi > FastMath.PI) {
                    dphi -= TWO_PI;
                } else if (dphi < -FastMath.PI) {
                    dphi += TWO_PI;
                }
                double f = te * inv;
                int k = (int) f;
                if (k > last) {
                    k = last;
                }
                double a = f - k;
                int o = 4 * k;
                double ww = rho * dphi, uu = u[j];
                double ci = tb[o + 1] + a * (tb[o + 5] - tb[o + 1]);
                double bi = tb[o + 2] + a * (tb[o + 6] - tb[o + 2]);
                double ai = tb[o + 3] + a * (tb[o + 7] - tb[o + 3]);
                double q = ci * uu * uu - 2 * bi * uu * ww + ai * ww * ww;
                if (q >= cutQ) {
                    continue;
                }
                double val = w[j] * (tb[o] + a * (tb[o + 4] - tb[o])) * CompactSourceModel.gaussian(0.5 * q);
                sf += val;
                sx += val * east[j];
                sy += val * north[j];
                if (pixels != null) {
                    pixels.add(east[j], north[j], val);
                }
            }
        }
        sums[0] += sf;
        sums[1] += sx;
        sums[2] += sy;
    }

    /** Receives a group's value at its sky position (PA = 0 offsets, M). */
    interface PixelSink {
        void add(double east, double north, double value);
    }

    /** @return the frame's phase Theta(t_o): the centre's azimuth at emission time t_o - d is psi - Theta away */
    double theta(double to) {
        return phiM + omega * (to - tm);
    }
}
