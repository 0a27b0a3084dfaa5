package org.spindrift.sim.motion;

/**
 * The stage and dense-output sums of {@link Dop853} written out term by term (one loop over the
 * 5 components of the coordinate-time state, {@link GeodesicEquations#DIM_T}), over the non-zero tableau
 * entries only (in the order of the rows, so with the roundings of the plain loops), with the
 * coefficients as constants. Generated once from the tableau's zero pattern, which the static
 * initialiser checks. Why: the loops over the tableau rows (a branch per term, loads of
 * coefficients and offsets) were about a third of {@link ParticleStepper}'s time in the
 * {@code bench motion} profile (JFR, measured, no source). Stage scratch layout: k[i * 5 + c].
 */
final class Dop853Sums {
    private Dop853Sums() {
    }

    // ---- generated from the zero pattern of Dop853 (the static check below verifies it) ----
    static final double A1_0 = Dop853.A[1][0];
    static final double A2_0 = Dop853.A[2][0];
    static final double A2_1 = Dop853.A[2][1];
    static final double A3_0 = Dop853.A[3][0];
    static final double A3_2 = Dop853.A[3][2];
    static final double A4_0 = Dop853.A[4][0];
    static final double A4_2 = Dop853.A[4][2];
    static final double A4_3 = Dop853.A[4][3];
    static final double A5_0 = Dop853.A[5][0];
    static final double A5_3 = Dop853.A[5][3];
    static final double A5_4 = Dop853.A[5][4];
    static final double A6_0 = Dop853.A[6][0];
    static final double A6_3 = Dop853.A[6][3];
    static final double A6_4 = Dop853.A[6][4];
    static final double A6_5 = Dop853.A[6][5];
    static final double A7_0 = Dop853.A[7][0];
    static final double A7_3 = Dop853.A[7][3];
    static final double A7_4 = Dop853.A[7][4];
    static final double A7_5 = Dop853.A[7][5];
    static final double A7_6 = Dop853.A[7][6];
    static final double A8_0 = Dop853.A[8][0];
    static final double A8_3 = Dop853.A[8][3];
    static final double A8_4 = Dop853.A[8][4];
    static final double A8_5 = Dop853.A[8][5];
    static final double A8_6 = Dop853.A[8][6];
    static final double A8_7 = Dop853.A[8][7];
    static final double A9_0 = Dop853.A[9][0];
    static final double A9_3 = Dop853.A[9][3];
    static final double A9_4 = Dop853.A[9][4];
    static final double A9_5 = Dop853.A[9][5];
    static final double A9_6 = Dop853.A[9][6];
    static final double A9_7 = Dop853.A[9][7];
    static final double A9_8 = Dop853.A[9][8];
    static final double A10_0 = Dop853.A[10][0];
    static final double A10_3 = Dop853.A[10][3];
    static final double A10_4 = Dop853.A[10][4];
    static final double A10_5 = Dop853.A[10][5];
    static final double A10_6 = Dop853.A[10][6];
    static final double A10_7 = Dop853.A[10][7];
    static final double A10_8 = Dop853.A[10][8];
    static final double A10_9 = Dop853.A[10][9];
    static final double A11_0 = Dop853.A[11][0];
    static final double A11_3 = Dop853.A[11][3];
    static final double A11_4 = Dop853.A[11][4];
    static final double A11_5 = Dop853.A[11][5];
    static final double A11_6 = Dop853.A[11][6];
    static final double A11_7 = Dop853.A[11][7];
    static final double A11_8 = Dop853.A[11][8];
    static final double A11_9 = Dop853.A[11][9];
    static final double A11_10 = Dop853.A[11][10];
    static final double A13_0 = Dop853.A[13][0];
    static final double A13_6 = Dop853.A[13][6];
    static final double A13_7 = Dop853.A[13][7];
    static final double A13_8 = Dop853.A[13][8];
    static final double A13_9 = Dop853.A[13][9];
    static final double A13_10 = Dop853.A[13][10];
    static final double A13_11 = Dop853.A[13][11];
    static final double A13_12 = Dop853.A[13][12];
    static final double A14_0 = Dop853.A[14][0];
    static final double A14_5 = Dop853.A[14][5];
    static final double A14_6 = Dop853.A[14][6];
    static final double A14_7 = Dop853.A[14][7];
    static final double A14_10 = Dop853.A[14][10];
    static final double A14_11 = Dop853.A[14][11];
    static final double A14_12 = Dop853.A[14][12];
    static final double A14_13 = Dop853.A[14][13];
    static final double A15_0 = Dop853.A[15][0];
    static final double A15_5 = Dop853.A[15][5];
    static final double A15_6 = Dop853.A[15][6];
    static final double A15_7 = Dop853.A[15][7];
    static final double A15_8 = Dop853.A[15][8];
    static final double A15_12 = Dop853.A[15][12];
    static final double A15_13 = Dop853.A[15][13];
    static final double A15_14 = Dop853.A[15][14];
    static final double B0 = Dop853.B[0];
    static final double E5_0 = Dop853.E5[0];
    static final double E3_0 = Dop853.E3[0];
    static final double B5 = Dop853.B[5];
    static final double E5_5 = Dop853.E5[5];
    static final double E3_5 = Dop853.E3[5];
    static final double B6 = Dop853.B[6];
    static final double E5_6 = Dop853.E5[6];
    static final double E3_6 = Dop853.E3[6];
    static final double B7 = Dop853.B[7];
    static final double E5_7 = Dop853.E5[7];
    static final double E3_7 = Dop853.E3[7];
    static final double B8 = Dop853.B[8];
    static final double E5_8 = Dop853.E5[8];
    static final double E3_8 = Dop853.E3[8];
    static final double B9 = Dop853.B[9];
    static final double E5_9 = Dop853.E5[9];
    static final double E3_9 = Dop853.E3[9];
    static final double B10 = Dop853.B[10];
    static final double E5_10 = Dop853.E5[10];
    static final double E3_10 = Dop853.E3[10];
    static final double B11 = Dop853.B[11];
    static final double E5_11 = Dop853.E5[11];
    static final double E3_11 = Dop853.E3[11];
    static final double D0_0 = Dop853.D[0][0];
    static final double D0_5 = Dop853.D[0][5];
    static final double D0_6 = Dop853.D[0][6];
    static final double D0_7 = Dop853.D[0][7];
    static final double D0_8 = Dop853.D[0][8];
    static final double D0_9 = Dop853.D[0][9];
    static final double D0_10 = Dop853.D[0][10];
    static final double D0_11 = Dop853.D[0][11];
    static final double D1_0 = Dop853.D[1][0];
    static final double D1_5 = Dop853.D[1][5];
    static final double D1_6 = Dop853.D[1][6];
    static final double D1_7 = Dop853.D[1][7];
    static final double D1_8 = Dop853.D[1][8];
    static final double D1_9 = Dop853.D[1][9];
    static final double D1_10 = Dop853.D[1][10];
    static final double D1_11 = Dop853.D[1][11];
    static final double D2_0 = Dop853.D[2][0];
    static final double D2_5 = Dop853.D[2][5];
    static final double D2_6 = Dop853.D[2][6];
    static final double D2_7 = Dop853.D[2][7];
    static final double D2_8 = Dop853.D[2][8];
    static final double D2_9 = Dop853.D[2][9];
    static final double D2_10 = Dop853.D[2][10];
    static final double D2_11 = Dop853.D[2][11];
    static final double D2_12 = Dop853.D[2][12];
    static final double D3_0 = Dop853.D[3][0];
    static final double D3_5 = Dop853.D[3][5];
    static final double D3_6 = Dop853.D[3][6];
    static final double D3_7 = Dop853.D[3][7];
    static final double D3_8 = Dop853.D[3][8];
    static final double D3_9 = Dop853.D[3][9];
    static final double D3_10 = Dop853.D[3][10];
    static final double D3_11 = Dop853.D[3][11];
    static final double D3_12 = Dop853.D[3][12];
    static final double D3_13 = Dop853.D[3][13];
    static final double D3_14 = Dop853.D[3][14];
    static final double D3_15 = Dop853.D[3][15];
    static final double D4_0 = Dop853.D[4][0];
    static final double D4_5 = Dop853.D[4][5];
    static final double D4_6 = Dop853.D[4][6];
    static final double D4_7 = Dop853.D[4][7];
    static final double D4_8 = Dop853.D[4][8];
    static final double D4_9 = Dop853.D[4][9];
    static final double D4_10 = Dop853.D[4][10];
    static final double D4_11 = Dop853.D[4][11];
    static final double D4_12 = Dop853.D[4][12];
    static final double D4_13 = Dop853.D[4][13];
    static final double D4_14 = Dop853.D[4][14];
    static final double D4_15 = Dop853.D[4][15];
    static final double D5_0 = Dop853.D[5][0];
    static final double D5_5 = Dop853.D[5][5];
    static final double D5_6 = Dop853.D[5][6];
    static final double D5_7 = Dop853.D[5][7];
    static final double D5_8 = Dop853.D[5][8];
    static final double D5_9 = Dop853.D[5][9];
    static final double D5_10 = Dop853.D[5][10];
    static final double D5_11 = Dop853.D[5][11];
    static final double D5_12 = Dop853.D[5][12];
    static final double D5_13 = Dop853.D[5][13];
    static final double D5_14 = Dop853.D[5][14];
    static final double D5_15 = Dop853.D[5][15];
    static final double D6_0 = Dop853.D[6][0];
    static final double D6_5 = Dop853.D[6][5];
    static final double D6_6 = Dop853.D[6][6];
    static final double D6_7 = Dop853.D[6][7];
    static final double D6_8 = Dop853.D[6][8];
    static final double D6_9 = Dop853.D[6][9];
    static final double D6_10 = Dop853.D[6][10];
    static final double D6_11 = Dop853.D[6][11];
    static final double D6_12 = Dop853.D[6][12];
    static final double D6_13 = Dop853.D[6][13];
    static final double D6_14 = Dop853.D[6][14];
    static final double D6_15 = Dop853.D[6][15];
    /** Indices of the non-zero entries of each row of A and D, as written out in the generated sums. */
    private static final int[][] A_NONZERO = {
        {},
        {0},
        {0, 1},
        {0, 2},
        {0, 2, 3},
        {0, 3, 4},
        {0, 3, 4, 5},
        {0, 3, 4, 5, 6},
        {0, 3, 4, 5, 6, 7},
        {0, 3, 4, 5, 6, 7, 8},
        {0, 3, 4, 5, 6, 7, 8, 9},
        {0, 3, 4, 5, 6, 7, 8, 9, 10},
        {},
        {0, 6, 7, 8, 9, 10, 11, 12},
        {0, 5, 6, 7, 10, 11, 12, 13},
        {0, 5, 6, 7, 8, 12, 13, 14},
    };
    private static final int[][] D_NONZERO = {
        {0, 5, 6, 7, 8, 9, 10, 11},
        {0, 5, 6, 7, 8, 9, 10, 11},
        {0, 5, 6, 7, 8, 9, 10, 11, 12},
        {0, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15},
        {0, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15},
        {0, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15},
        {0, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15},
    };
    private static final int[] B_NONZERO = {0, 5, 6, 7, 8, 9, 10, 11};

    static {
        // the unrolled sums below skip exactly the zero coefficients; fail loudly if the tableau changes
        checkPattern(Dop853.A, A_NONZERO, 12);
        checkPattern(Dop853.D, D_NONZERO, -1);
        checkPattern(new double[][] {Dop853.B, Dop853.E5, Dop853.E3},
                new int[][] {B_NONZERO, B_NONZERO, B_NONZERO}, -1);
    }

    private static void checkPattern(double[][] rows, int[][] nonZero, int skipRow) {
        for (int s = 0; s < rows.length; s++) {
            if (s == skipRow) {
                continue; // A[12] = B, never used as a stage input (first same as last)
            }
            for (int i = 0; i < rows[s].length; i++) {
                final int col = i;
                boolean listed = java.util.Arrays.stream(nonZero[s]).anyMatch(x -> x == col);
                if (listed != (rows[s][i] != 0.0)) {
                    throw new IllegalStateException("Dop853 row " + s + " entry " + i
                            + " does not match the unrolled sums");
                }
            }
        }
    }

    /** yt = y0 + h sum_i a_{s,i} k_i over the non-zero a_{s,i} (s = 1..11, 13..15), term by term, constants folded. */
    static void stageInput(int s, double h, double[] y0, double[] k, double[] yt) {
        switch (s) {
            case 1:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A1_0 * k[c]);
                }
                return;
            case 2:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A2_0 * k[c] + A2_1 * k[5 + c]);
                }
                return;
            case 3:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A3_0 * k[c] + A3_2 * k[10 + c]);
                }
                return;
            case 4:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A4_0 * k[c] + A4_2 * k[10 + c] + A4_3 * k[15 + c]);
                }
                return;
            case 5:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A5_0 * k[c] + A5_3 * k[15 + c] + A5_4 * k[20 + c]);
                }
                return;
            case 6:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A6_0 * k[c] + A6_3 * k[15 + c] + A6_4 * k[20 + c] + A6_5 * k[25 + c]);
                }
                return;
            case 7:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A7_0 * k[c] + A7_3 * k[15 + c] + A7_4 * k[20 + c] + A7_5 * k[25 + c]
                            + A7_6 * k[30 + c]);
                }
                return;
            case 8:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A8_0 * k[c] + A8_3 * k[15 + c] + A8_4 * k[20 + c] + A8_5 * k[25 + c]
                            + A8_6 * k[30 + c] + A8_7 * k[35 + c]);
                }
                return;
            case 9:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A9_0 * k[c] + A9_3 * k[15 + c] + A9_4 * k[20 + c] + A9_5 * k[25 + c]
                            + A9_6 * k[30 + c] + A9_7 * k[35 + c] + A9_8 * k[40 + c]);
                }
                return;
            case 10:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A10_0 * k[c] + A10_3 * k[15 + c] + A10_4 * k[20 + c] + A10_5 * k[25 + c]
                            + A10_6 * k[30 + c] + A10_7 * k[35 + c] + A10_8 * k[40 + c] + A10_9 * k[45 + c]);
                }
                return;
            case 11:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A11_0 * k[c] + A11_3 * k[15 + c] + A11_4 * k[20 + c] + A11_5 * k[25 + c]
                            + A11_6 * k[30 + c] + A11_7 * k[35 + c] + A11_8 * k[40 + c] + A11_9 * k[45 + c]
                            + A11_10 * k[50 + c]);
                }
                return;
            case 13:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A13_0 * k[c] + A13_6 * k[30 + c] + A13_7 * k[35 + c] + A13_8 * k[40 + c]
                            + A13_9 * k[45 + c] + A13_10 * k[50 + c] + A13_11 * k[55 + c] + A13_12 * k[60 + c]);
                }
                return;
            case 14:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A14_0 * k[c] + A14_5 * k[25 + c] + A14_6 * k[30 + c] + A14_7 * k[35 + c]
                            + A14_10 * k[50 + c] + A14_11 * k[55 + c] + A14_12 * k[60 + c] + A14_13 * k[65 + c]);
                }
                return;
            case 15:
                for (int c = 0; c < 5; c++) {
                    yt[c] = y0[c] + h * (A15_0 * k[c] + A15_5 * k[25 + c] + A15_6 * k[30 + c] + A15_7 * k[35 + c]
                            + A15_8 * k[40 + c] + A15_12 * k[60 + c] + A15_13 * k[65 + c] + A15_14 * k[70 + c]);
                }
                return;
            default:
                throw new IllegalArgumentException("stage " + s);
        }
    }

    /** rc[m * 5 + c] = h sum_i D[m][i] k_i over the non-zero D[m][i], m = 0..6 (dense-output coefficients). */
    static void dense(double h, double[] k, double[] rc) {
        for (int c = 0; c < 5; c++) {
            rc[c] = h * (D0_0 * k[c] + D0_5 * k[25 + c] + D0_6 * k[30 + c] + D0_7 * k[35 + c] + D0_8 * k[40 + c]
                    + D0_9 * k[45 + c] + D0_10 * k[50 + c] + D0_11 * k[55 + c]);
            rc[5 + c] = h * (D1_0 * k[c] + D1_5 * k[25 + c] + D1_6 * k[30 + c] + D1_7 * k[35 + c] + D1_8 * k[40 + c]
                    + D1_9 * k[45 + c] + D1_10 * k[50 + c] + D1_11 * k[55 + c]);
            rc[10 + c] = h * (D2_0 * k[c] + D2_5 * k[25 + c] + D2_6 * k[30 + c] + D2_7 * k[35 + c] + D2_8 * k[40 + c]
                    + D2_9 * k[45 + c] + D2_10 * k[50 + c] + D2_11 * k[55 + c] + D2_12 * k[60 + c]);
            rc[15 + c] = h * (D3_0 * k[c] + D3_5 * k[25 + c] + D3_6 * k[30 + c] + D3_7 * k[35 + c] + D3_8 * k[40 + c]
                    + D3_9 * k[45 + c] + D3_10 * k[50 + c] + D3_11 * k[55 + c] + D3_12 * k[60 + c] + D3_13 * k[65 + c]
                    + D3_14 * k[70 + c] + D3_15 * k[75 + c]);
            rc[20 + c] = h * (D4_0 * k[c] + D4_5 * k[25 + c] + D4_6 * k[30 + c] + D4_7 * k[35 + c] + D4_8 * k[40 + c]
                    + D4_9 * k[45 + c] + D4_10 * k[50 + c] + D4_11 * k[55 + c] + D4_12 * k[60 + c] + D4_13 * k[65 + c]
                    + D4_14 * k[70 + c] + D4_15 * k[75 + c]);
            rc[25 + c] = h * (D5_0 * k[c] + D5_5 * k[25 + c] + D5_6 * k[30 + c] + D5_7 * k[35 + c] + D5_8 * k[40 + c]
                    + D5_9 * k[45 + c] + D5_10 * k[50 + c] + D5_11 * k[55 + c] + D5_12 * k[60 + c] + D5_13 * k[65 + c]
                    + D5_14 * k[70 + c] + D5_15 * k[75 + c]);
            rc[30 + c] = h * (D6_0 * k[c] + D6_5 * k[25 + c] + D6_6 * k[30 + c] + D6_7 * k[35 + c] + D6_8 * k[40 + c]
                    + D6_9 * k[45 + c] + D6_10 * k[50 + c] + D6_11 * k[55 + c] + D6_12 * k[60 + c] + D6_13 * k[65 + c]
                    + D6_14 * k[70 + c] + D6_15 * k[75 + c]);
        }
    }
}
