package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Locale;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

/** NumberText writes what java.util.Formatter writes (the reference: the running JDK's own formatter). */
class NumberTextTest {
    private static final double[] EDGES = {0.0, -0.0, 1, -1, 0.5, 1.5, 2.5, 0.05, 0.15, 0.25, 0.35, 0.45, 0.95, 9.5,
        99.5, 999999.5, 999999.4, 9999995, 999995, 0.0001, 0.00009999995, 0.000099999949, 1e-4, 1e6, 1e7, 123456.5,
        1234567, 1.0000005, 2.0000005, 1e-300, 4.9e-324, Double.MAX_VALUE, Double.MIN_NORMAL, 1e22, 1e23, 1e100,
        1e-100, 12345678912345678.0, 0.1 + 0.2, 1 / 3.0, 2 / 3.0, 1e21, 123e-7, Math.PI, -Math.E, 5e-5, 4.5e-5,
        0.049999999999999996, 0.06, 0.004, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};

    private static void same(double d) {
        assertEquals(String.format(Locale.ROOT, "%.6g", d), NumberText.significant6(d), "%.6g of " + d);
        for (int digits : new int[] {1, 3, 17}) {
            assertEquals(String.format(Locale.ROOT, "%." + digits + "g", d), NumberText.significant(d, digits),
                    "%." + digits + "g of " + d);
        }
        if (Math.abs(d) < 1e30 || Double.isNaN(d) || Double.isInfinite(d)) {
            for (int decimals = 0; decimals <= 3; decimals++) {
                assertEquals(String.format(Locale.ROOT, "%." + decimals + "f", d), NumberText.fixed(d, decimals),
                        "%." + decimals + "f of " + d);
            }
        }
    }

    @Test
    void edgesOfRoundingAndOfTheScientificFormAreWrittenAsTheFormatterWritesThem() {
        for (double d : EDGES) {
            same(d);
            same(-d);
        }
    }

    @Test
    void randomValuesOfEveryMagnitudeAreWrittenAsTheFormatterWritesThem() {
        SplittableRandom random = new SplittableRandom(20261202L);
        for (int i = 0; i < 20_000; i++) {
            double magnitude = Math.pow(10, random.nextInt(-12, 13));
            double d = random.nextDouble(-1, 1) * magnitude;
            same(d);
            // Values with few decimals, where half-way digits are common (readings to 0.5, 0.05, ...).
            same(Math.round(d * 200) / 200.0);
            same(Math.round(d * 2000) / 2000.0);
        }
        for (int i = 0; i < 5_000; i++) {
            same(Double.longBitsToDouble(random.nextLong()));
        }
    }
}
