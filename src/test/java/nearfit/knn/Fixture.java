package nearfit.knn;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.HashMap;
import java.util.Map;

/** Reads a fixture written by scripts/reference/make-knn-fixtures.py: named matrices of doubles. */
final class Fixture {
    private final Map<String, double[][]> tables = new HashMap<>();

    static Fixture load(String name) {
        Fixture f = new Fixture();
        try (InputStream in = Fixture.class.getResourceAsStream("/knn/" + name);
             BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("@")) {
                    String[] h = line.substring(1).split(" ");
                    int rows = Integer.parseInt(h[1]);
                    int cols = Integer.parseInt(h[2]);
                    double[][] t = new double[rows][cols];
                    for (int i = 0; i < rows; i++) {
                        String[] v = r.readLine().trim().split(" ");
                        for (int j = 0; j < cols; j++) {
                            t[i][j] = Double.parseDouble(v[j]);
                        }
                    }
                    f.tables.put(h[0], t);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return f;
    }

    double[][] table(String name) {
        double[][] t = tables.get(name);
        if (t == null) {
            throw new IllegalArgumentException("no table " + name);
        }
        return t;
    }

    /** A one-column table as a vector. */
    double[] vector(String name) {
        double[][] t = table(name);
        double[] v = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            v[i] = t[i][0];
        }
        return v;
    }

    /** Columns of a table (column-major copy). */
    double[][] columns(String name) {
        double[][] t = table(name);
        double[][] c = new double[t[0].length][t.length];
        for (int i = 0; i < t.length; i++) {
            for (int j = 0; j < t[0].length; j++) {
                c[j][i] = t[i][j];
            }
        }
        return c;
    }
}
