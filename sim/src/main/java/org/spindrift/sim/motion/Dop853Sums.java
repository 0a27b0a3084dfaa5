package org.spindrift.sim.motion;

/**
 * The stage, dense-output and solution sums of {@link Dop853} written out term by term for the
 * 5-component coordinate-time state ({@link GeodesicEquations#DIM_T}), over the non-zero tableau
 * entries only (in the order of the rows, so with the roundings of the plain loops), with the
 * coefficients as constants. Generated once from the tableau's zero pattern, which the static
 * initialiser checks. Why: the loops over the tableau rows (a branch per term, loads of
 * coefficients and offsets) were about a third of {@link ParticleStepper}'s time in the
 * {@code bench motion} profile (JFR, measured, no source); and a loop over the five components
 * around the written-out terms (here and in {@link ParticleStepper#attempt}) still cost 5 to 7 %
 * of its thread CPU time (three alternating runs each, measured, no source), so the components
 * are written out too. Stage scratch layout: k[i * 5 + c].
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

    /** yt = y0 + h sum_i a_{s,i} k_i over the non-zero a_{s,i} (s = 1..11, 13..15), unrolled, constants folded. */
    static void stageInput(int s, double h, double[] y0, double[] k, double[] yt) {
        switch (s) {
            case 1:
                yt[0] = y0[0] + h * (A1_0 * k[0]);
                yt[1] = y0[1] + h * (A1_0 * k[1]);
                yt[2] = y0[2] + h * (A1_0 * k[2]);
                yt[3] = y0[3] + h * (A1_0 * k[3]);
                yt[4] = y0[4] + h * (A1_0 * k[4]);
                return;
            case 2:
                yt[0] = y0[0] + h * (A2_0 * k[0] + A2_1 * k[5]);
                yt[1] = y0[1] + h * (A2_0 * k[1] + A2_1 * k[6]);
                yt[2] = y0[2] + h * (A2_0 * k[2] + A2_1 * k[7]);
                yt[3] = y0[3] + h * (A2_0 * k[3] + A2_1 * k[8]);
                yt[4] = y0[4] + h * (A2_0 * k[4] + A2_1 * k[9]);
                return;
            case 3:
                yt[0] = y0[0] + h * (A3_0 * k[0] + A3_2 * k[10]);
                yt[1] = y0[1] + h * (A3_0 * k[1] + A3_2 * k[11]);
                yt[2] = y0[2] + h * (A3_0 * k[2] + A3_2 * k[12]);
                yt[3] = y0[3] + h * (A3_0 * k[3] + A3_2 * k[13]);
                yt[4] = y0[4] + h * (A3_0 * k[4] + A3_2 * k[14]);
                return;
            case 4:
                yt[0] = y0[0] + h * (A4_0 * k[0] + A4_2 * k[10] + A4_3 * k[15]);
                yt[1] = y0[1] + h * (A4_0 * k[1] + A4_2 * k[11] + A4_3 * k[16]);
                yt[2] = y0[2] + h * (A4_0 * k[2] + A4_2 * k[12] + A4_3 * k[17]);
                yt[3] = y0[3] + h * (A4_0 * k[3] + A4_2 * k[13] + A4_3 * k[18]);
                yt[4] = y0[4] + h * (A4_0 * k[4] + A4_2 * k[14] + A4_3 * k[19]);
                return;
            case 5:
                yt[0] = y0[0] + h * (A5_0 * k[0] + A5_3 * k[15] + A5_4 * k[20]);
                yt[1] = y0[1] + h * (A5_0 * k[1] + A5_3 * k[16] + A5_4 * k[21]);
                yt[2] = y0[2] + h * (A5_0 * k[2] + A5_3 * k[17] + A5_4 * k[22]);
                yt[3] = y0[3] + h * (A5_0 * k[3] + A5_3 * k[18] + A5_4 * k[23]);
                yt[4] = y0[4] + h * (A5_0 * k[4] + A5_3 * k[19] + A5_4 * k[24]);
                return;
            case 6:
                yt[0] = y0[0] + h * (A6_0 * k[0] + A6_3 * k[15] + A6_4 * k[20] + A6_5 * k[25]);
                yt[1] = y0[1] + h * (A6_0 * k[1] + A6_3 * k[16] + A6_4 * k[21] + A6_5 * k[26]);
                yt[2] = y0[2] + h * (A6_0 * k[2] + A6_3 * k[17] + A6_4 * k[22] + A6_5 * k[27]);
                yt[3] = y0[3] + h * (A6_0 * k[3] + A6_3 * k[18] + A6_4 * k[23] + A6_5 * k[28]);
                yt[4] = y0[4] + h * (A6_0 * k[4] + A6_3 * k[19] + A6_4 * k[24] + A6_5 * k[29]);
                return;
            case 7:
                yt[0] = y0[0] + h * (A7_0 * k[0] + A7_3 * k[15] + A7_4 * k[20] + A7_5 * k[25] + A7_6 * k[30]);
                yt[1] = y0[1] + h * (A7_0 * k[1] + A7_3 * k[16] + A7_4 * k[21] + A7_5 * k[26] + A7_6 * k[31]);
                yt[2] = y0[2] + h * (A7_0 * k[2] + A7_3 * k[17] + A7_4 * k[22] + A7_5 * k[27] + A7_6 * k[32]);
                yt[3] = y0[3] + h * (A7_0 * k[3] + A7_3 * k[18] + A7_4 * k[23] + A7_5 * k[28] + A7_6 * k[33]);
                yt[4] = y0[4] + h * (A7_0 * k[4] + A7_3 * k[19] + A7_4 * k[24] + A7_5 * k[29] + A7_6 * k[34]);
                return;
            case 8:
                yt[0] = y0[0] + h * (A8_0 * k[0] + A8_3 * k[15] + A8_4 * k[20] + A8_5 * k[25] + A8_6 * k[30]
                        + A8_7 * k[35]);
                yt[1] = y0[1] + h * (A8_0 * k[1] + A8_3 * k[16] + A8_4 * k[21] + A8_5 * k[26] + A8_6 * k[31]
                        + A8_7 * k[36]);
                yt[2] = y0[2] + h * (A8_0 * k[2] + A8_3 * k[17] + A8_4 * k[22] + A8_5 * k[27] + A8_6 * k[32]
                        + A8_7 * k[37]);
                yt[3] = y0[3] + h * (A8_0 * k[3] + A8_3 * k[18] + A8_4 * k[23] + A8_5 * k[28] + A8_6 * k[33]
                        + A8_7 * k[38]);
                yt[4] = y0[4] + h * (A8_0 * k[4] + A8_3 * k[19] + A8_4 * k[24] + A8_5 * k[29] + A8_6 * k[34]
                        + A8_7 * k[39]);
                return;
            case 9:
                yt[0] = y0[0] + h * (A9_0 * k[0] + A9_3 * k[15] + A9_4 * k[20] + A9_5 * k[25] + A9_6 * k[30]
                        + A9_7 * k[35] + A9_8 * k[40]);
                yt[1] = y0[1] + h * (A9_0 * k[1] + A9_3 * k[16] + A9_4 * k[21] + A9_5 * k[26] + A9_6 * k[31]
                        + A9_7 * k[36] + A9_8 * k[41]);
                yt[2] = y0[2] + h * (A9_0 * k[2] + A9_3 * k[17] + A9_4 * k[22] + A9_5 * k[27] + A9_6 * k[32]
                        + A9_7 * k[37] + A9_8 * k[42]);
                yt[3] = y0[3] + h * (A9_0 * k[3] + A9_3 * k[18] + A9_4 * k[23] + A9_5 * k[28] + A9_6 * k[33]
                        + A9_7 * k[38] + A9_8 * k[43]);
                yt[4] = y0[4] + h * (A9_0 * k[4] + A9_3 * k[19] + A9_4 * k[24] + A9_5 * k[29] + A9_6 * k[34]
                        + A9_7 * k[39] + A9_8 * k[44]);
                return;
            case 10:
                yt[0] = y0[0] + h * (A10_0 * k[0] + A10_3 * k[15] + A10_4 * k[20] + A10_5 * k[25] + A10_6 * k[30]
                        + A10_7 * k[35] + A10_8 * k[40] + A10_9 * k[45]);
                yt[1] = y0[1] + h * (A10_0 * k[1] + A10_3 * k[16] + A10_4 * k[21] + A10_5 * k[26] + A10_6 * k[31]
                        + A10_7 * k[36] + A10_8 * k[41] + A10_9 * k[46]);
                yt[2] = y0[2] + h * (A10_0 * k[2] + A10_3 * k[17] + A10_4 * k[22] + A10_5 * k[27] + A10_6 * k[32]
                        + A10_7 * k[37] + A10_8 * k[42] + A10_9 * k[47]);
                yt[3] = y0[3] + h * (A10_0 * k[3] + A10_3 * k[18] + A10_4 * k[23] + A10_5 * k[28] + A10_6 * k[33]
                        + A10_7 * k[38] + A10_8 * k[43] + A10_9 * k[48]);
                yt[4] = y0[4] + h * (A10_0 * k[4] + A10_3 * k[19] + A10_4 * k[24] + A10_5 * k[29] + A10_6 * k[34]
                        + A10_7 * k[39] + A10_8 * k[44] + A10_9 * k[49]);
                return;
            case 11:
                yt[0] = y0[0] + h * (A11_0 * k[0] + A11_3 * k[15] + A11_4 * k[20] + A11_5 * k[25] + A11_6 * k[30]
                        + A11_7 * k[35] + A11_8 * k[40] + A11_9 * k[45] + A11_10 * k[50]);
                yt[1] = y0[1] + h * (A11_0 * k[1] + A11_3 * k[16] + A11_4 * k[21] + A11_5 * k[26] + A11_6 * k[31]
                        + A11_7 * k[36] + A11_8 * k[41] + A11_9 * k[46] + A11_10 * k[51]);
                yt[2] = y0[2] + h * (A11_0 * k[2] + A11_3 * k[17] + A11_4 * k[22] + A11_5 * k[27] + A11_6 * k[32]
                        + A11_7 * k[37] + A11_8 * k[42] + A11_9 * k[47] + A11_10 * k[52]);
                yt[3] = y0[3] + h * (A11_0 * k[3] + A11_3 * k[18] + A11_4 * k[23] + A11_5 * k[28] + A11_6 * k[33]
                        + A11_7 * k[38] + A11_8 * k[43] + A11_9 * k[48] + A11_10 * k[53]);
                yt[4] = y0[4] + h * (A11_0 * k[4] + A11_3 * k[19] + A11_4 * k[24] + A11_5 * k[29] + A11_6 * k[34]
                        + A11_7 * k[39] + A11_8 * k[44] + A11_9 * k[49] + A11_10 * k[54]);
                return;
            case 13:
                yt[0] = y0[0] + h * (A13_0 * k[0] + A13_6 * k[30] + A13_7 * k[35] + A13_8 * k[40] + A13_9 * k[45]
                        + A13_10 * k[50] + A13_11 * k[55] + A13_12 * k[60]);
                yt[1] = y0[1] + h * (A13_0 * k[1] + A13_6 * k[31] + A13_7 * k[36] + A13_8 * k[41] + A13_9 * k[46]
                        + A13_10 * k[51] + A13_11 * k[56] + A13_12 * k[61]);
                yt[2] = y0[2] + h * (A13_0 * k[2] + A13_6 * k[32] + A13_7 * k[37] + A13_8 * k[42] + A13_9 * k[47]
                        + A13_10 * k[52] + A13_11 * k[57] + A13_12 * k[62]);
                yt[3] = y0[3] + h * (A13_0 * k[3] + A13_6 * k[33] + A13_7 * k[38] + A13_8 * k[43] + A13_9 * k[48]
                        + A13_10 * k[53] + A13_11 * k[58] + A13_12 * k[63]);
                yt[4] = y0[4] + h * (A13_0 * k[4] + A13_6 * k[34] + A13_7 * k[39] + A13_8 * k[44] + A13_9 * k[49]
                        + A13_10 * k[54] + A13_11 * k[59] + A13_12 * k[64]);
                return;
            case 14:
                yt[0] = y0[0] + h * (A14_0 * k[0] + A14_5 * k[25] + A14_6 * k[30] + A14_7 * k[35] + A14_10 * k[50]
                        + A14_11 * k[55] + A14_12 * k[60] + A14_13 * k[65]);
                yt[1] = y0[1] + h * (A14_0 * k[1] + A14_5 * k[26] + A14_6 * k[31] + A14_7 * k[36] + A14_10 * k[51]
                        + A14_11 * k[56] + A14_12 * k[61] + A14_13 * k[66]);
                yt[2] = y0[2] + h * (A14_0 * k[2] + A14_5 * k[27] + A14_6 * k[32] + A14_7 * k[37] + A14_10 * k[52]
                        + A14_11 * k[57] + A14_12 * k[62] + A14_13 * k[67]);
                yt[3] = y0[3] + h * (A14_0 * k[3] + A14_5 * k[28] + A14_6 * k[33] + A14_7 * k[38] + A14_10 * k[53]
                        + A14_11 * k[58] + A14_12 * k[63] + A14_13 * k[68]);
                yt[4] = y0[4] + h * (A14_0 * k[4] + A14_5 * k[29] + A14_6 * k[34] + A14_7 * k[39] + A14_10 * k[54]
                        + A14_11 * k[59] + A14_12 * k[64] + A14_13 * k[69]);
                return;
            case 15:
                yt[0] = y0[0] + h * (A15_0 * k[0] + A15_5 * k[25] + A15_6 * k[30] + A15_7 * k[35] + A15_8 * k[40]
                        + A15_12 * k[60] + A15_13 * k[65] + A15_14 * k[70]);
                yt[1] = y0[1] + h * (A15_0 * k[1] + A15_5 * k[26] + A15_6 * k[31] + A15_7 * k[36] + A15_8 * k[41]
                        + A15_12 * k[61] + A15_13 * k[66] + A15_14 * k[71]);
                yt[2] = y0[2] + h * (A15_0 * k[2] + A15_5 * k[27] + A15_6 * k[32] + A15_7 * k[37] + A15_8 * k[42]
                        + A15_12 * k[62] + A15_13 * k[67] + A15_14 * k[72]);
                yt[3] = y0[3] + h * (A15_0 * k[3] + A15_5 * k[28] + A15_6 * k[33] + A15_7 * k[38] + A15_8 * k[43]
                        + A15_12 * k[63] + A15_13 * k[68] + A15_14 * k[73]);
                yt[4] = y0[4] + h * (A15_0 * k[4] + A15_5 * k[29] + A15_6 * k[34] + A15_7 * k[39] + A15_8 * k[44]
                        + A15_12 * k[64] + A15_13 * k[69] + A15_14 * k[74]);
                return;
            default:
                throw new IllegalArgumentException("stage " + s);
        }
    }

    /** rc[m * 5 + c] = h sum_i D[m][i] k_i over the non-zero D[m][i], m = 0..6 (dense-output coefficients). */
    static void dense(double h, double[] k, double[] rc) {
        rc[0] = h * (D0_0 * k[0] + D0_5 * k[25] + D0_6 * k[30] + D0_7 * k[35] + D0_8 * k[40] + D0_9 * k[45]
                + D0_10 * k[50] + D0_11 * k[55]);
        rc[1] = h * (D0_0 * k[1] + D0_5 * k[26] + D0_6 * k[31] + D0_7 * k[36] + D0_8 * k[41] + D0_9 * k[46]
                + D0_10 * k[51] + D0_11 * k[56]);
        rc[2] = h * (D0_0 * k[2] + D0_5 * k[27] + D0_6 * k[32] + D0_7 * k[37] + D0_8 * k[42] + D0_9 * k[47]
                + D0_10 * k[52] + D0_11 * k[57]);
        rc[3] = h * (D0_0 * k[3] + D0_5 * k[28] + D0_6 * k[33] + D0_7 * k[38] + D0_8 * k[43] + D0_9 * k[48]
                + D0_10 * k[53] + D0_11 * k[58]);
        rc[4] = h * (D0_0 * k[4] + D0_5 * k[29] + D0_6 * k[34] + D0_7 * k[39] + D0_8 * k[44] + D0_9 * k[49]
                + D0_10 * k[54] + D0_11 * k[59]);
        rc[5] = h * (D1_0 * k[0] + D1_5 * k[25] + D1_6 * k[30] + D1_7 * k[35] + D1_8 * k[40] + D1_9 * k[45]
                + D1_10 * k[50] + D1_11 * k[55]);
        rc[6] = h * (D1_0 * k[1] + D1_5 * k[26] + D1_6 * k[31] + D1_7 * k[36] + D1_8 * k[41] + D1_9 * k[46]
                + D1_10 * k[51] + D1_11 * k[56]);
        rc[7] = h * (D1_0 * k[2] + D1_5 * k[27] + D1_6 * k[32] + D1_7 * k[37] + D1_8 * k[42] + D1_9 * k[47]
                + D1_10 * k[52] + D1_11 * k[57]);
        rc[8] = h * (D1_0 * k[3] + D1_5 * k[28] + D1_6 * k[33] + D1_7 * k[38] + D1_8 * k[43] + D1_9 * k[48]
                + D1_10 * k[53] + D1_11 * k[58]);
        rc[9] = h * (D1_0 * k[4] + D1_5 * k[29] + D1_6 * k[34] + D1_7 * k[39] + D1_8 * k[44] + D1_9 * k[49]
                + D1_10 * k[54] + D1_11 * k[59]);
        rc[10] = h * (D2_0 * k[0] + D2_5 * k[25] + D2_6 * k[30] + D2_7 * k[35] + D2_8 * k[40] + D2_9 * k[45]
                + D2_10 * k[50] + D2_11 * k[55] + D2_12 * k[60]);
        rc[11] = h * (D2_0 * k[1] + D2_5 * k[26] + D2_6 * k[31] + D2_7 * k[36] + D2_8 * k[41] + D2_9 * k[46]
                + D2_10 * k[51] + D2_11 * k[56] + D2_12 * k[61]);
        rc[12] = h * (D2_0 * k[2] + D2_5 * k[27] + D2_6 * k[32] + D2_7 * k[37] + D2_8 * k[42] + D2_9 * k[47]
                + D2_10 * k[52] + D2_11 * k[57] + D2_12 * k[62]);
        rc[13] = h * (D2_0 * k[3] + D2_5 * k[28] + D2_6 * k[33] + D2_7 * k[38] + D2_8 * k[43] + D2_9 * k[48]
                + D2_10 * k[53] + D2_11 * k[58] + D2_12 * k[63]);
        rc[14] = h * (D2_0 * k[4] + D2_5 * k[29] + D2_6 * k[34] + D2_7 * k[39] + D2_8 * k[44] + D2_9 * k[49]
                + D2_10 * k[54] + D2_11 * k[59] + D2_12 * k[64]);
        rc[15] = h * (D3_0 * k[0] + D3_5 * k[25] + D3_6 * k[30] + D3_7 * k[35] + D3_8 * k[40] + D3_9 * k[45]
                + D3_10 * k[50] + D3_11 * k[55] + D3_12 * k[60] + D3_13 * k[65] + D3_14 * k[70] + D3_15 * k[75]);
        rc[16] = h * (D3_0 * k[1] + D3_5 * k[26] + D3_6 * k[31] + D3_7 * k[36] + D3_8 * k[41] + D3_9 * k[46]
                + D3_10 * k[51] + D3_11 * k[56] + D3_12 * k[61] + D3_13 * k[66] + D3_14 * k[71] + D3_15 * k[76]);
        rc[17] = h * (D3_0 * k[2] + D3_5 * k[27] + D3_6 * k[32] + D3_7 * k[37] + D3_8 * k[42] + D3_9 * k[47]
                + D3_10 * k[52] + D3_11 * k[57] + D3_12 * k[62] + D3_13 * k[67] + D3_14 * k[72] + D3_15 * k[77]);
        rc[18] = h * (D3_0 * k[3] + D3_5 * k[28] + D3_6 * k[33] + D3_7 * k[38] + D3_8 * k[43] + D3_9 * k[48]
                + D3_10 * k[53] + D3_11 * k[58] + D3_12 * k[63] + D3_13 * k[68] + D3_14 * k[73] + D3_15 * k[78]);
        rc[19] = h * (D3_0 * k[4] + D3_5 * k[29] + D3_6 * k[34] + D3_7 * k[39] + D3_8 * k[44] + D3_9 * k[49]
                + D3_10 * k[54] + D3_11 * k[59] + D3_12 * k[64] + D3_13 * k[69] + D3_14 * k[74] + D3_15 * k[79]);
        rc[20] = h * (D4_0 * k[0] + D4_5 * k[25] + D4_6 * k[30] + D4_7 * k[35] + D4_8 * k[40] + D4_9 * k[45]
                + D4_10 * k[50] + D4_11 * k[55] + D4_12 * k[60] + D4_13 * k[65] + D4_14 * k[70] + D4_15 * k[75]);
        rc[21] = h * (D4_0 * k[1] + D4_5 * k[26] + D4_6 * k[31] + D4_7 * k[36] + D4_8 * k[41] + D4_9 * k[46]
                + D4_10 * k[51] + D4_11 * k[56] + D4_12 * k[61] + D4_13 * k[66] + D4_14 * k[71] + D4_15 * k[76]);
        rc[22] = h * (D4_0 * k[2] + D4_5 * k[27] + D4_6 * k[32] + D4_7 * k[37] + D4_8 * k[42] + D4_9 * k[47]
                + D4_10 * k[52] + D4_11 * k[57] + D4_12 * k[62] + D4_13 * k[67] + D4_14 * k[72] + D4_15 * k[77]);
        rc[23] = h * (D4_0 * k[3] + D4_5 * k[28] + D4_6 * k[33] + D4_7 * k[38] + D4_8 * k[43] + D4_9 * k[48]
                + D4_10 * k[53] + D4_11 * k[58] + D4_12 * k[63] + D4_13 * k[68] + D4_14 * k[73] + D4_15 * k[78]);
        rc[24] = h * (D4_0 * k[4] + D4_5 * k[29] + D4_6 * k[34] + D4_7 * k[39] + D4_8 * k[44] + D4_9 * k[49]
                + D4_10 * k[54] + D4_11 * k[59] + D4_12 * k[64] + D4_13 * k[69] + D4_14 * k[74] + D4_15 * k[79]);
        rc[25] = h * (D5_0 * k[0] + D5_5 * k[25] + D5_6 * k[30] + D5_7 * k[35] + D5_8 * k[40] + D5_9 * k[45]
                + D5_10 * k[50] + D5_11 * k[55] + D5_12 * k[60] + D5_13 * k[65] + D5_14 * k[70] + D5_15 * k[75]);
        rc[26] = h * (D5_0 * k[1] + D5_5 * k[26] + D5_6 * k[31] + D5_7 * k[36] + D5_8 * k[41] + D5_9 * k[46]
                + D5_10 * k[51] + D5_11 * k[56] + D5_12 * k[61] + D5_13 * k[66] + D5_14 * k[71] + D5_15 * k[76]);
        rc[27] = h * (D5_0 * k[2] + D5_5 * k[27] + D5_6 * k[32] + D5_7 * k[37] + D5_8 * k[42] + D5_9 * k[47]
                + D5_10 * k[52] + D5_11 * k[57] + D5_12 * k[62] + D5_13 * k[67] + D5_14 * k[72] + D5_15 * k[77]);
        rc[28] = h * (D5_0 * k[3] + D5_5 * k[28] + D5_6 * k[33] + D5_7 * k[38] + D5_8 * k[43] + D5_9 * k[48]
                + D5_10 * k[53] + D5_11 * k[58] + D5_12 * k[63] + D5_13 * k[68] + D5_14 * k[73] + D5_15 * k[78]);
        rc[29] = h * (D5_0 * k[4] + D5_5 * k[29] + D5_6 * k[34] + D5_7 * k[39] + D5_8 * k[44] + D5_9 * k[49]
                + D5_10 * k[54] + D5_11 * k[59] + D5_12 * k[64] + D5_13 * k[69] + D5_14 * k[74] + D5_15 * k[79]);
        rc[30] = h * (D6_0 * k[0] + D6_5 * k[25] + D6_6 * k[30] + D6_7 * k[35] + D6_8 * k[40] + D6_9 * k[45]
                + D6_10 * k[50] + D6_11 * k[55] + D6_12 * k[60] + D6_13 * k[65] + D6_14 * k[70] + D6_15 * k[75]);
        rc[31] = h * (D6_0 * k[1] + D6_5 * k[26] + D6_6 * k[31] + D6_7 * k[36] + D6_8 * k[41] + D6_9 * k[46]
                + D6_10 * k[51] + D6_11 * k[56] + D6_12 * k[61] + D6_13 * k[66] + D6_14 * k[71] + D6_15 * k[76]);
        rc[32] = h * (D6_0 * k[2] + D6_5 * k[27] + D6_6 * k[32] + D6_7 * k[37] + D6_8 * k[42] + D6_9 * k[47]
                + D6_10 * k[52] + D6_11 * k[57] + D6_12 * k[62] + D6_13 * k[67] + D6_14 * k[72] + D6_15 * k[77]);
        rc[33] = h * (D6_0 * k[3] + D6_5 * k[28] + D6_6 * k[33] + D6_7 * k[38] + D6_8 * k[43] + D6_9 * k[48]
                + D6_10 * k[53] + D6_11 * k[58] + D6_12 * k[63] + D6_13 * k[68] + D6_14 * k[73] + D6_15 * k[78]);
        rc[34] = h * (D6_0 * k[4] + D6_5 * k[29] + D6_6 * k[34] + D6_7 * k[39] + D6_8 * k[44] + D6_9 * k[49]
                + D6_10 * k[54] + D6_11 * k[59] + D6_12 * k[64] + D6_13 * k[69] + D6_14 * k[74] + D6_15 * k[79]);
    }
}
