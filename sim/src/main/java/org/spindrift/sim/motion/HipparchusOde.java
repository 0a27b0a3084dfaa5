package org.spindrift.sim.motion;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * One member of a {@link BatchEquations} batch as a Hipparchus {@link OrdinaryDifferentialEquation},
 * so that Hipparchus' own integrators can serve as the independent reference (benchmark,
 * validation suite, tests). It allocates a derivative array per evaluation, as Hipparchus'
 * interface requires: a reference, not a hot loop.
 */
public final class HipparchusOde implements OrdinaryDifferentialEquation {
    /** Smallest step allowed to the reference integrator (M). */
    private static final double MIN_STEP = 1e-10;

    private final BatchEquations eq;
    private final double c0;
    private final double c1;
    private long evaluations;

    /**
     * @param eq the equations (the instance is used by this adapter alone)
     * @param c0 the member's first constant (geodesics: p_t)
     * @param c1 the member's second constant (geodesics: p_phi)
     */
    public HipparchusOde(BatchEquations eq, double c0, double c1) {
        this.eq = eq;
        this.c0 = c0;
        this.c1 = c1;
    }

    @Override public int getDimension() {
        return eq.dimension();
    }

    @Override public double[] computeDerivatives(double t, double[] y) {
        double[] dy = new double[eq.dimension()];
        eq.derivatives(c0, c1, y, 0, dy, 0);
        evaluations++;
        return dy;
    }

    /** @return right-hand-side evaluations so far */
    public long evaluations() {
        return evaluations;
    }

    /**
     * Integrates from (t0, y0) with Hipparchus' DormandPrince853Integrator (absolute and relative
     * tolerance tol, steps up to maxStep) and returns the state at each of the increasing times,
     * from its dense output.
     */
    public double[][] sample(double t0, double[] y0, double[] times, double tol, double maxStep) {
        DormandPrince853Integrator integ = new DormandPrince853Integrator(MIN_STEP, maxStep, tol, tol);
        double[][] out = new double[times.length][];
        integ.addStepHandler(new ODEStepHandler() {
            private int next;

            @Override public void handleStep(ODEStateInterpolator in) {
                while (next < times.length && times[next] <= in.getCurrentState().getTime()) {
                    out[next] = in.getInterpolatedState(times[next]).getPrimaryState();
                    next++;
                }
            }
        });
        integ.integrate(this, new ODEState(t0, y0.clone()), times[times.length - 1]);
        return out;
    }

    /**
     * Integrates from (t0, y0) to each of the increasing times in turn, restarting Hipparchus'
     * DormandPrince853Integrator at every one (the states land on the times exactly, no dense output).
     */
    public double[][] restartAt(double t0, double[] y0, double[] times, double tol, double maxStep) {
        DormandPrince853Integrator integ = new DormandPrince853Integrator(MIN_STEP, maxStep, tol, tol);
        double[][] out = new double[times.length][];
        ODEState state = new ODEState(t0, y0.clone());
        for (int k = 0; k < times.length; k++) {
            out[k] = integ.integrate(this, state, times[k]).getPrimaryState();
            state = new ODEState(times[k], out[k]);
        }
        return out;
    }
}
