package org.viscarta.cli;

import java.util.Arrays;
import picocli.CommandLine;

/**
 * A time grid in seconds: {@code FROM:TO:COUNT} (log-spaced, both ends included), e.g.
 * {@code 0.01:100:25}, or a comma-separated list such as {@code 0.1,1,10}.
 */
final class TimeGridConverter implements CommandLine.ITypeConverter<TimeGridConverter.Grid> {

    /** The times, in seconds. */
    record Grid(double[] seconds) {
        Grid {
            seconds = seconds.clone();
        }

        @Override
        public double[] seconds() {
            return seconds.clone();
        }
    }

    @Override
    public Grid convert(String value) {
        try {
            double[] grid;
            if (value.contains(":")) {
                String[] f = value.split(":");
                if (f.length != 3) {
                    throw new NumberFormatException();
                }
                double from = Double.parseDouble(f[0].strip());
                double to = Double.parseDouble(f[1].strip());
                int n = Integer.parseInt(f[2].strip());
                if (!(from > 0 && to > from) || n < 2 || n > 10000) {
                    throw new NumberFormatException();
                }
                grid = new double[n];
                for (int i = 0; i < n; i++) {
                    grid[i] = from * Math.pow(to / from, i / (double) (n - 1));
                }
            } else {
                grid = Arrays.stream(value.split(",")).map(String::strip).mapToDouble(Double::parseDouble).toArray();
            }
            for (double t : grid) {
                if (!(t > 0) || Double.isInfinite(t)) {
                    throw new NumberFormatException();
                }
            }
            return new Grid(grid);
        } catch (NumberFormatException e) {
            throw new CommandLine.TypeConversionException("'" + value + "' is not a time grid; write FROM:TO:COUNT in seconds "
                    + "(log-spaced, e.g. 0.01:100:25) or a list such as 0.1,1,10 (all times > 0)");
        }
    }
}
