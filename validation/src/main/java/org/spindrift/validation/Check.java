package org.spindrift.validation;

/**
 * One validation check: a measured quantity against a reference value from a named source,
 * passing when |measured - reference| &lt;= tolerance.
 *
 * @param group section of the report
 * @param quantity what is compared (with the orbit or case)
 * @param reference the reference value
 * @param source where the reference comes from
 * @param measured the value the engine produced
 * @param tolerance the allowed absolute difference
 */
public record Check(String group, String quantity, double reference, String source, double measured,
                    double tolerance) {
    /** @return true when the measured value agrees with the reference within the tolerance */
    public boolean passed() {
        return Math.abs(measured - reference) <= tolerance;
    }

    /** @return |measured - reference| */
    public double difference() {
        return Math.abs(measured - reference);
    }
}
