package dev.annotator.io;

import dev.annotator.error.UsageException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

/** The output file's promise: at the target path there is either nothing new or the whole, committed file. */
class AtomicOutputFileTest {
    private static final byte[] OLD = "old\n".getBytes(StandardCharsets.US_ASCII);
    private static final byte[] NEW = "new\n".getBytes(StandardCharsets.US_ASCII);

    @TempDir
    Path dir;

    @Test
    void nothingAppearsUntilCommitAndAllOfItAfter() throws IOException {
        Path target = dir.resolve("out.txt");
        try (AtomicOutputFile f = AtomicOutputFile.createNew(target)) {
            f.stream().write(NEW);
            f.stream().flush();
            assertThat(target).doesNotExist();
            f.commit();
        }
        assertThat(Files.readAllBytes(target)).isEqualTo(NEW);
        assertThat(names()).containsExactly("out.txt");
    }

    @Test
    void aFailureMidwayLeavesNeitherTargetNorTemporaryFile() throws IOException {
        Path target = dir.resolve("out.txt");
        Throwable failure = catchThrowableOfType(IllegalStateException.class, () -> {
            try (AtomicOutputFile f = AtomicOutputFile.createNew(target)) {
                f.stream().write(new byte[200_000]); // past the buffer, so bytes reach the temporary file
                throw new IllegalStateException("failure midway");
            }
        });
        assertThat(failure).hasMessage("failure midway");
        assertThat(names()).isEmpty();
    }

    @Test
    void createNewRefusesAnExistingFileAndLeavesItAlone() throws IOException {
        Path target = Files.write(dir.resolve("out.txt"), OLD);
        UsageException e = catchThrowableOfType(UsageException.class, () -> AtomicOutputFile.createNew(target));
        assertThat(e).hasMessage(target + ": already exists");
        assertThat(e.exitCode()).isEqualTo(2);
        assertThat(Files.readAllBytes(target)).isEqualTo(OLD);
        assertThat(names()).containsExactly("out.txt");
    }

    @Test
    void aFileThatAppearsWhileWritingIsNotReplacedByCreateNew() throws IOException {
        Path target = dir.resolve("out.txt");
        try (AtomicOutputFile f = AtomicOutputFile.createNew(target)) {
            f.stream().write(NEW);
            Files.write(target, OLD); // another process got there first
            UsageException e = catchThrowableOfType(UsageException.class, f::commit);
            assertThat(e.getMessage()).startsWith(target + ": already exists");
        }
        assertThat(Files.readAllBytes(target)).isEqualTo(OLD);
        assertThat(names()).containsExactly("out.txt");
    }

    @Test
    void createReplacesAnExistingFile() throws IOException {
        Path target = Files.write(dir.resolve("out.txt"), OLD);
        try (AtomicOutputFile f = AtomicOutputFile.create(target)) {
            f.stream().write(NEW);
            f.commit();
        }
        assertThat(Files.readAllBytes(target)).isEqualTo(NEW);
        assertThat(names()).containsExactly("out.txt");
    }

    private java.util.List<String> names() throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.map(p -> p.getFileName().toString()).toList();
        }
    }
}
