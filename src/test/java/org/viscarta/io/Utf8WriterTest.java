package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The writer's bytes against the JDK's own UTF-8 {@link OutputStreamWriter} (the reference: the
 * same text, the same calls): ASCII, two- and three-byte characters, surrogate pairs, lone high and
 * low surrogates (replaced by '?'), a pair split between two calls, a high surrogate left at the end,
 * and texts longer than the buffers.
 */
@Tag("validation")
class Utf8WriterTest {

    private static final char[] ALPHABET = {'a', 'Z', '0', '<', '&', '\n', '\t', 'é', 'δ', '′', '″', '°', '±', '\u00a0',
        '\u07ff', '\u0800', '\uffff', '\ufffe', '\ud83d', '\ude00', '\ud800', '\udfff'};

    @Test
    void sameBytesAsTheJdksWriterOnRandomTextsAndCalls() throws IOException {
        SplittableRandom rng = new SplittableRandom(20261203);
        for (int trial = 0; trial < 300; trial++) {
            int length = trial < 250 ? rng.nextInt(0, 200) : rng.nextInt(30_000, 90_000);
            StringBuilder text = new StringBuilder();
            for (int i = 0; i < length; i++) {
                text.append(rng.nextInt(4) == 0 ? ALPHABET[rng.nextInt(ALPHABET.length)] : (char) rng.nextInt(0x20, 0x7f));
            }
            String s = text.toString();
            ByteArrayOutputStream expected = new ByteArrayOutputStream();
            ByteArrayOutputStream actual = new ByteArrayOutputStream();
            try (Writer jdk = new OutputStreamWriter(expected, StandardCharsets.UTF_8); Writer ours = new Utf8Writer(actual)) {
                int at = 0;
                while (at < s.length()) {
                    int n = Math.min(s.length() - at, rng.nextInt(1, 40_000));
                    switch (rng.nextInt(4)) {
                        case 0 -> {
                            jdk.write(s.substring(at, at + n));
                            ours.write(s.substring(at, at + n));
                        }
                        case 1 -> {
                            jdk.write(s.toCharArray(), at, n);
                            ours.write(s.toCharArray(), at, n);
                        }
                        case 2 -> {
                            n = 1;
                            jdk.write(s.charAt(at));
                            ours.write(s.charAt(at));
                        }
                        default -> {
                            jdk.write(s, at, n);
                            ours.write(s, at, n);
                            jdk.flush();
                            ours.flush();
                        }
                    }
                    at += n;
                }
            }
            assertArrayEquals(expected.toByteArray(), actual.toByteArray(), "trial " + trial);
        }
    }
    /**
     * A surrogate pair across the places where the writer cuts a text: the end of one call and the
     * start of the next, and the 4,096-character pieces a long text is encoded in (the random texts
     * above meet these rarely: a high surrogate at a cut, followed by a low one).
     */
    @Test
    void aSurrogatePairSplitByACallOrAPieceIsOneCharacter() throws IOException {
        String pair = "\ud83d\ude00";
        List<List<String>> calls = List.of(
                List.of("x\ud83d", "\ude00y"),
                List.of("\ud83d", "\ude00"),
                List.of("a".repeat(4095) + pair + "b"),
                List.of("a".repeat(4094) + pair + pair + "b"),
                List.of("a".repeat(8191) + pair),
                List.of("a".repeat(4095) + "\ud83d", "\ude00"),
                List.of("\ud83d", "z"));
        for (List<String> texts : calls) {
            ByteArrayOutputStream expected = new ByteArrayOutputStream();
            ByteArrayOutputStream actual = new ByteArrayOutputStream();
            try (Writer jdk = new OutputStreamWriter(expected, StandardCharsets.UTF_8); Writer ours = new Utf8Writer(actual)) {
                for (String t : texts) {
                    jdk.write(t);
                    ours.write(t);
                }
            }
            assertArrayEquals(expected.toByteArray(), actual.toByteArray(), texts.stream().map(String::length).toList().toString());
        }
    }
}
