package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.io.ByteArrayOutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** The unlocked writer gives the bytes the JDK's UTF-8 writer gives for the same calls. */
@Tag("self-check")
class UnlockedWriterTest {

    @Test
    void sameBytesAsTheJdkWriterForAnyMixOfCalls() throws Exception {
        Random r = new Random(21);
        // ASCII, Latin, Greek, a character outside the basic plane (a surrogate pair, split across calls below)
        String alphabet = "abc<>&\"'0123456789.E-éδ′″ \n𝛿";
        StringBuilder all = new StringBuilder();
        while (all.length() < 200_000) {
            all.append(alphabet.charAt(r.nextInt(alphabet.length())));
        }
        String text = all.toString();
        ByteArrayOutputStream want = new ByteArrayOutputStream();
        ByteArrayOutputStream got = new ByteArrayOutputStream();
        try (Writer a = new OutputStreamWriter(want, StandardCharsets.UTF_8);
             Writer b = new UnlockedWriter(new OutputStreamWriter(got, StandardCharsets.UTF_8))) {
            int at = 0;
            while (at < text.length()) {
                // single characters, short runs and runs longer than the buffer (16,384 characters)
                int len = Math.min(text.length() - at, switch (r.nextInt(4)) {
                    case 0 -> 1;
                    case 1 -> 1 + r.nextInt(20);
                    case 2 -> 1 + r.nextInt(5_000);
                    default -> 16_000 + r.nextInt(4_000);
                });
                switch (r.nextInt(4)) {
                    case 0 -> {
                        for (int k = at; k < at + len; k++) {
                            a.write(text.charAt(k));
                            b.write(text.charAt(k));
                        }
                    }
                    case 1 -> {
                        a.write(text, at, len);
                        b.write(text, at, len);
                    }
                    case 2 -> {
                        a.write(text.substring(at, at + len));
                        b.write(text.substring(at, at + len));
                    }
                    default -> {
                        a.write(text.toCharArray(), at, len);
                        b.write(text.toCharArray(), at, len);
                    }
                }
                at += len;
            }
        }
        assertArrayEquals(want.toByteArray(), got.toByteArray());
        assertArrayEquals(text.getBytes(StandardCharsets.UTF_8), got.toByteArray());
    }
}
