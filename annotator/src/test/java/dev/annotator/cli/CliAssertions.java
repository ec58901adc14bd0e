package dev.annotator.cli;

import static org.assertj.core.api.Assertions.assertThat;

/** What the README promises for every failure, checked on one run. */
final class CliAssertions {
    private CliAssertions() {
    }

    /**
     * The exit status; one line on standard error, prefixed "annotator: error: " and containing {@code mention}
     * (file, line, record or option and what is wrong); no stack trace.
     */
    static void assertOneLineError(CliRun.Result r, int status, String mention) {
        assertThat(r.status()).as("exit status; stderr: %s", r.stderr()).isEqualTo(status);
        assertThat(r.errLines()).as("stderr").hasSize(1);
        String line = r.errLines().get(0);
        assertThat(line).startsWith("annotator: error: ").contains(mention);
        assertThat(line).doesNotContain("Exception").doesNotContain("\tat ");
    }
}
