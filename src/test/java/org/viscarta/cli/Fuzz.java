package org.viscarta.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Stream;

/**
 * Our own fuzzing of the reading verbs and the fits: random and structured mutations of the reader
 * corpus and the demo files through {@code inspect}, {@code rank}, {@code fit} and
 * {@code moduli}, and a set of degenerate numbers through {@code fit} with the whole catalogue.
 * Every outcome must be a reading (exit 0) or a clean input error (exit 2, one line naming the
 * file); never another exception (exit 1), and never a changed input. Run bounded by time in the
 * suite ({@code FuzzTest}) and at length as a benchmark ({@code Benchmarks ... fuzz-only}).
 */
public final class Fuzz {

    /**
     * What a run saw.
     *
     * @param trials    inputs tried
     * @param read      runs that exited 0
     * @param refused   runs refused with a clean one-line input or usage error (exit 2)
     * @param failures  descriptions of anything else (empty when the promise held)
     */
    public record Outcome(int trials, int read, int refused, List<String> failures) {
    }

    private static final byte[] ALPHABET =
            "0123456789.,;\t -+eE#[]()\"'\n\r|*/µ°abcdefghijklmnopqrstuvwxyzHzPaGMk_:=@".getBytes(StandardCharsets.UTF_8);

    private static final String[] DEGENERATE = {
        "# sample: one\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,1000,100\n",
        "# sample: two\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,1000,100\n2,1000,100\n",
        "# sample: same-frequency\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,1000,100\n1,1100,90\n1,900,110\n1,1000,100\n",
        "# sample: huge\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1e-200,1e300,1e299\n1,1e300,1e299\n1e200,1e300,1e299\n",
        "# sample: tiny\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1e-300,1e-300,1e-301\n1e-299,2e-300,1e-301\n1e-298,3e-300,2e-301\n",
        "# sample: flat\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000,1000\n1,1000,1000\n10,1000,1000\n100,1000,1000\n",
        "# sample: liquid\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1e-6,10\n1,1e-4,100\n10,1e-2,1000\n",
        "# sample: zero-loss\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000,0\n1,1000,0\n10,1000,0\n",
        "# sample: wild\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1e9,1\n1,1,1e9\n10,1e9,1\n100,1,1e9\n",
    };

    private Fuzz() {
    }

    /**
     * Runs until {@code maxTrials} inputs or {@code budget} have been spent, whichever comes first.
     *
     * @param seed the random seed
     * @param work a folder for the inputs and outputs
     */
    public static Outcome run(long seed, int maxTrials, Duration budget, Path work) throws IOException {
        List<byte[]> seeds = seeds();
        SplittableRandom rng = new SplittableRandom(seed);
        long end = System.nanoTime() + budget.toNanos();
        int read = 0;
        int refused = 0;
        int trials = 0;
        List<String> failures = new ArrayList<>();
        for (String d : DEGENERATE) {
            trials++;
            Path f = work.resolve("degenerate.csv");
            Files.writeString(f, d);
            String verdict = judge(f, new String[] {"fit", f.toString()});
            if (verdict.equals("read")) {
                read++;
            } else if (verdict.equals("refused")) {
                refused++;
            } else {
                failures.add(verdict + " on " + d.lines().findFirst().orElse(""));
            }
        }
        while (trials < maxTrials && System.nanoTime() < end) {
            trials++;
            byte[] data = mutate(seeds.get(rng.nextInt(seeds.size())), rng);
            Path f = work.resolve("fuzz-" + (trials % 7) + ".csv");
            Files.write(f, data);
            String[] args;
            switch (rng.nextInt(4)) {
                case 0 -> args = new String[] {"inspect", f.toString()};
                case 1 -> args = new String[] {"rank", f.toString()};
                case 2 -> args = new String[] {"fit", f.toString(), "--models", "springpot,zener,fractional-zener,generalized-maxwell"};
                default -> args = new String[] {"moduli", f.toString(), "--out", work.resolve("moduli").toString(), "--force"};
            }
            String verdict = judge(f, args);
            if (verdict.equals("read")) {
                read++;
            } else if (verdict.equals("refused")) {
                refused++;
            } else if (failures.size() < 20) {
                failures.add(verdict + " on " + args[0] + " of input " + Arrays.toString(Arrays.copyOf(data, Math.min(80, data.length))));
            }
        }
        return new Outcome(trials, read, refused, failures);
    }

    /** "read", "refused", or what went wrong. */
    private static String judge(Path input, String[] args) throws IOException {
        byte[] before = Files.readAllBytes(input);
        CliRun r = CliRun.of(args);
        if (!Arrays.equals(before, Files.readAllBytes(input))) {
            return "the input was changed";
        }
        if (r.exitCode() == 0) {
            return "read";
        }
        String err = r.err().strip();
        String last = err.lines().reduce((a, b) -> b).orElse("");
        if (r.exitCode() == 2 && (last.startsWith(input.toString()) || last.startsWith("viscarta: "))
                && !last.contains("internal error")) {
            return "refused";
        }
        return String.format(Locale.ROOT, "exit %d: %s", r.exitCode(), last);
    }

    private static byte[] mutate(byte[] base, SplittableRandom rng) {
        if (rng.nextInt(10) == 0) {
            byte[] data = new byte[rng.nextInt(300)];
            for (int i = 0; i < data.length; i++) {
                data[i] = ALPHABET[rng.nextInt(ALPHABET.length)];
            }
            return data;
        }
        byte[] data = base.clone();
        int edits = 1 + rng.nextInt(5);
        for (int k = 0; k < edits && data.length > 0; k++) {
            int at = rng.nextInt(data.length);
            switch (rng.nextInt(5)) {
                case 0 -> data[at] = ALPHABET[rng.nextInt(ALPHABET.length)];
                case 1 -> data[at] = (byte) rng.nextInt(256);
                case 2 -> data = Arrays.copyOf(data, at);
                case 3 -> {
                    // a structured edit: a line duplicated or dropped
                    String text = new String(data, StandardCharsets.UTF_8);
                    List<String> lines = new ArrayList<>(text.lines().toList());
                    if (!lines.isEmpty()) {
                        int i = rng.nextInt(lines.size());
                        if (rng.nextBoolean()) {
                            lines.add(i, lines.get(i));
                        } else {
                            lines.remove(i);
                        }
                    }
                    data = (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8);
                }
                default -> {
                    // a number replaced by an extreme or odd one
                    String text = new String(data, StandardCharsets.UTF_8);
                    String[] odd = {"0", "-0", "1e308", "1e-320", "NaN", "Infinity", "-1", "", "1,5", "1e", "0x10"};
                    data = text.replaceFirst("\\d+(\\.\\d+)?", odd[rng.nextInt(odd.length)]).getBytes(StandardCharsets.UTF_8);
                }
            }
        }
        return data;
    }

    private static List<byte[]> seeds() throws IOException {
        List<byte[]> seeds = new ArrayList<>();
        try (Stream<Path> s = Files.list(Path.of("src", "test", "resources", "reader-corpus"))) {
            for (Path p : s.filter(x -> x.getFileName().toString().matches("\\d\\d-.*")).sorted().toList()) {
                seeds.add(Files.readAllBytes(p));
            }
        }
        for (String demo : List.of("hydrogel-screen/gelatin-5pct-r1.csv", "hydrogel-screen/target-soft-tissue-r1.csv",
                "temperature-series/acrylic-film-10-to-50C.csv", "raw-signals/alkyd-unaged-raw.csv")) {
            byte[] b = Files.readAllBytes(Path.of("demo-data").resolve(demo));
            seeds.add(Arrays.copyOf(b, Math.min(b.length, 6000)));
        }
        return seeds;
    }
}
