package nearfit.plot;

/**
 * Tick positions and their labels along one axis, in data units (epoch milliseconds for time
 * axes). Invariant: {@code values} ascending, one label per value.
 *
 * @param values tick positions, ascending
 * @param labels compact labels, same length as values
 */
public record Ticks(double[] values, String[] labels) {
    /** Checks the invariant. */
    public Ticks {
        if (values.length != labels.length) {
            throw new IllegalArgumentException(values.length + " ticks but " + labels.length + " labels");
        }
    }

    /** @return the number of ticks */
    public int size() {
        return values.length;
    }

    /** @return the ticks that fall within [min, max] */
    public Ticks within(double min, double max) {
        int n = 0;
        for (double v : values) {
            if (v >= min && v <= max) {
                n++;
            }
        }
        double[] vs = new double[n];
        String[] ls = new String[n];
        int j = 0;
        for (int i = 0; i < values.length; i++) {
            if (values[i] >= min && values[i] <= max) {
                vs[j] = values[i];
                ls[j++] = labels[i];
            }
        }
        return new Ticks(vs, ls);
    }
}
