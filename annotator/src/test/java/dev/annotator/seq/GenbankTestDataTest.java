package dev.annotator.seq;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.FieldSource;

import java.io.IOException;
import java.nio.file.Files;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The published GenBank files are the copies their provenance names: each one's SHA-256 (FIPS 180-4, computed by
 * the JDK's MessageDigest) must equal the checksum written in its row of test-data/README.md, so a damaged or
 * replaced copy fails here, loudly, before any count drawn from it is believed.
 */
class GenbankTestDataTest {
    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void checksumMatchesTheProvenanceTable(String file) throws IOException, NoSuchAlgorithmException {
        String readme = Files.readString(PublishedGenbankRecords.testData("README.md"));
        Matcher row = Pattern.compile("(?m)^\\| `genbank/" + Pattern.quote(file) + "` \\|.*?sha256 `([0-9a-f]{64})`")
                .matcher(readme);
        assertThat(row.find()).as("a row with a sha256 for genbank/%s in test-data/README.md", file).isTrue();
        byte[] bytes = Files.readAllBytes(PublishedGenbankRecords.path(file));
        byte[] digest = MessageDigest.getInstance("SHA-256").digest(bytes);
        assertThat(HexFormat.of().formatHex(digest)).isEqualTo(row.group(1));
    }
}
