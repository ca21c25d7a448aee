package nearfit.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Small invented wind-site logs for the command tests: 10-minute rows of time, turbine (T01..),
 * wind_ms, temp_c and power_kw, where power follows a logistic power curve (rated 2000 kW, steepest
 * at 8 m/s) plus noise. A turbine can be made to under-perform by a fraction.
 */
final class WindSiteCsv {
    private WindSiteCsv() {
    }

    /** The power curve without noise, kW. */
    static double curve(double windMs) {
        return 2000.0 / (1.0 + Math.exp(-0.9 * (windMs - 8.0)));
    }

    /**
     * Writes {@code rowsPerTurbine} rows for each of {@code turbines} turbines from 2026-01-01; turbine
     * {@code weak} (1-based, 0 for none) delivers {@code 1 - shortfall} of the curve from row
     * {@code weakFrom} on.
     */
    static Path write(Path file, int turbines, int rowsPerTurbine, long seed, int weak, int weakFrom,
                      double shortfall) throws IOException {
        SplittableRandom random = new SplittableRandom(seed);
        StringBuilder sb = new StringBuilder("time,turbine,wind_ms,temp_c,power_kw\n");
        long start = Instant.parse("2026-01-01T00:00:00Z").toEpochMilli();
        for (int r = 0; r < rowsPerTurbine; r++) {
            String time = Instant.ofEpochMilli(start + r * 600_000L).toString();
            for (int t = 1; t <= turbines; t++) {
                double wind = 2.0 + 14.0 * random.nextDouble();
                double temp = -5.0 + 25.0 * random.nextDouble();
                double power = curve(wind) + 40.0 * gaussian(random);
                if (t == weak && r >= weakFrom) {
                    power *= 1.0 - shortfall;
                }
                sb.append(time).append(",T0").append(t).append(',')
                        .append(String.format(Locale.ROOT, "%.3f,%.2f,%.1f", wind, temp, power)).append('\n');
            }
        }
        Files.writeString(file, sb.toString(), StandardCharsets.UTF_8);
        return file;
    }

    /** A standard normal deviate (Box-Muller), for noise. */
    private static double gaussian(SplittableRandom random) {
        double u = 1.0 - random.nextDouble();
        double v = random.nextDouble();
        return Math.sqrt(-2.0 * Math.log(u)) * Math.cos(2.0 * Math.PI * v);
    }
}
