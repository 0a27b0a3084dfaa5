package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.FloatBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.Header;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.viewer.sky.CentroidTrack;
import org.spindrift.viewer.sky.ImageCube;

/**
 * The sky files as the light stage writes them, read by the viewer through the shared archive
 * reader: a FITS cube with a linear time axis in minutes and celestial offsets in degrees, and
 * centroid.csv. World coordinates of pixel p follow the
 * linear WCS rule x = CRVAL + CDELT (p - CRPIX) (Greisen &amp; Calabretta 2002, A&amp;A 395,
 * 1061, eq. 1 and 3 with the unit matrix).
 */
class SkyFilesTest {
    @TempDir Path tmp;

    static final double M_SECONDS = 4.925490947; // GM/c^3 for 1e6 solar masses (IAU 2015 GM_sun; UnitsTest)

    @Test void imageCubeFramesTimesAndScale() throws Exception {
        int nx = 8;
        int ny = 6;
        int nf = 3;
        float[][][] cube = new float[nf][ny][nx];
        for (int f = 0; f < nf; f++) {
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    cube[f][j][i] = 100 * f + 10 * j + i;
                }
            }
        }
        Path file = tmp.resolve(ArchiveLayout.IMAGES);
        try (Fits fits = new Fits()) {
            BasicHDU<?> hdu = Fits.makeHDU(cube);
            Header h = hdu.getHeader();
            h.addValue("CTYPE1", "OFLN-TAN", "");
            h.addValue("CTYPE2", "OFLT-TAN", "");
            h.addValue("CTYPE3", "TIME", "");
            h.addValue("CUNIT1", "deg", "");
            h.addValue("CUNIT2", "deg", "");
            h.addValue("CUNIT3", "min", "");
            h.addValue("CRPIX1", 4.5, "");
            h.addValue("CRPIX2", 3.5, "");
            h.addValue("CRPIX3", 1.0, "");
            h.addValue("CRVAL3", 12.0, "");
            h.addValue("CDELT1", -2.5 / 3.6e9, "2.5 micro-arcseconds, east to the left");
            h.addValue("CDELT2", 2.5 / 3.6e9, "");
            h.addValue("CDELT3", 0.5, "");
            fits.addHDU(hdu);
            fits.write(file.toFile());
        }
        try (ImageCube c = ImageCube.open(tmp, M_SECONDS)) {
            assertEquals(nx, c.width());
            assertEquals(ny, c.height());
            assertEquals(nf, c.frames());
            assertEquals(-2.5, c.cdelt1(), 1e-9, "deg -> micro-arcseconds: 3.6e9 per degree");
            assertEquals(2.5, c.cdelt2(), 1e-9);
            for (int f = 0; f < nf; f++) {
                // frame f at CRVAL3 + CDELT3 (f + 1 - CRPIX3) minutes, converted to M
                assertEquals((12.0 + 0.5 * f) * 60 / M_SECONDS, c.time(f), 1e-9);
            }
            FloatBuffer b = FloatBuffer.allocate(nx * ny);
            c.readFrame(2, b);
            assertEquals(200 + 10 * 5 + 7, b.get(5 * nx + 7), "row-major, NAXIS1 fastest");
            assertEquals(-1, c.frameAt(c.time(0) - 60), "before the first frame");
            assertEquals(1, c.frameAt(c.time(1) + 1e-6));
            assertEquals(2, c.frameAt(c.time(2) + 1e3));
            assertEquals(257f, c.max(), "brightest pixel of the sampled frames");
        }
    }

    @Test void centroidTableOfTheLightStage() throws Exception {
        Path file = tmp.resolve(ArchiveLayout.CENTROID);
        // the header line of the format document, written out by hand (not taken from our constants)
        String header = "t_obs_min,t_obs_M,x_uas,y_uas,flux,x_with_steady_uas,y_with_steady_uas,sigma_xx_uas2,"
                + "sigma_yy_uas2,sigma_xy_uas2\n";
        Files.writeString(file, header
                + "1.0,2.0,3.5,-4.0,10,0,0,0,0,0\n1.5,3.0,NaN,NaN,0,0,0,0,0,0\n2.0,4.0,-1.0,2.0,12,0,0,0,0,0\n");
        CentroidTrack t = CentroidTrack.read(tmp);
        assertEquals(3, t.size());
        assertEquals(2.0, t.t(0), "t_obs_M is taken as is");
        assertEquals(3.5, t.x(0));
        assertEquals(-4.0, t.y(0));
        assertTrue(Double.isNaN(t.x(1)), "no flux in a frame: no centroid");
        assertEquals(12.0, t.maxFlux());
        assertEquals(1, t.indexAt(3.5));
        assertEquals(-1, t.indexAt(1.0));
        assertEquals(4.0, t.maxOffset());
        Files.writeString(file, header + "1,3,0,0,1,0,0,0,0,0\n1,2,0,0,1,0,0,0,0,0\n");
        UserInputException e = assertThrows(UserInputException.class, () -> CentroidTrack.read(tmp));
        assertTrue(e.getMessage().contains("decreases") && e.getMessage().contains("line 3"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        // the old invented aliases are not read: one name per column
        Files.writeString(file, "t_obs,centroid_x_uas,centroid_y_uas\n1,0,0\n");
        e = assertThrows(UserInputException.class, () -> CentroidTrack.read(tmp));
        assertTrue(e.getMessage().contains("t_obs_min"), e.getMessage());
    }

    @Test void cubeInAnotherUnitIsRefused() throws Exception {
        try (Fits fits = new Fits()) {
            BasicHDU<?> hdu = Fits.makeHDU(new float[2][4][4]);
            hdu.getHeader().addValue("CUNIT1", "arcsec", "");
            hdu.getHeader().addValue("CDELT1", -1e-6, "");
            hdu.getHeader().addValue("CDELT2", 1e-6, "");
            fits.addHDU(hdu);
            fits.write(tmp.resolve(ArchiveLayout.IMAGES).toFile());
        }
        UserInputException e = assertThrows(UserInputException.class, () -> ImageCube.open(tmp, M_SECONDS));
        assertTrue(e.getMessage().contains("CUNIT1") && e.getMessage().contains("deg"), e.getMessage());
    }
}
