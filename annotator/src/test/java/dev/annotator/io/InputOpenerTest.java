package dev.annotator.io;

import dev.annotator.error.AnnotatorException;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.error.MissingInputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.SequenceInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Arrays;
import java.util.zip.GZIPOutputStream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

class InputOpenerTest {
    private static final byte[] TEXT = ">r1 demo\nACGTNNacgt\n>r2\nGGCC\n".getBytes(StandardCharsets.US_ASCII);

    @TempDir
    Path dir;

    @Test
    void readsPlainFileAsIs() throws IOException {
        Path f = write("plain.fa", TEXT);
        assertThat(readAll(f.toString(), InputStream.nullInputStream())).isEqualTo(TEXT);
    }

    @Test
    void gzipIsRecognisedByContentNotByName() throws IOException {
        // compressed data under a plain name, plain data under a .gz name
        Path compressed = write("looks-plain.fa", gzip(TEXT));
        Path plain = write("looks-compressed.fa.gz", TEXT);
        assertThat(readAll(compressed.toString(), null)).isEqualTo(TEXT);
        assertThat(readAll(plain.toString(), null)).isEqualTo(TEXT);
    }

    @Test
    void concatenatedGzipMembersReadAsOneStream() throws IOException {
        // RFC 1952 section 2.2: a gzip file is a series of members; readers return their concatenation
        byte[] first = Arrays.copyOfRange(TEXT, 0, 10);
        byte[] second = Arrays.copyOfRange(TEXT, 10, TEXT.length);
        Path f = write("two-members.gz", concat(gzip(first), gzip(second)));
        assertThat(readAll(f.toString(), null)).isEqualTo(TEXT);
    }

    @Test
    void shortInputsThatAreNotGzipSurviveTheMagicCheck() throws IOException {
        assertThat(readAll(write("empty.fa", new byte[0]).toString(), null)).isEmpty();
        assertThat(readAll(write("one.fa", new byte[] {0x1f}).toString(), null)).containsExactly(0x1f);
    }

    @Test
    void dashReadsTheGivenStdinAndLeavesItOpen() throws IOException {
        ClosingProbe stdin = new ClosingProbe(gzip(TEXT));
        try (InputStream in = InputOpener.open("-", stdin)) {
            assertThat(in.readAllBytes()).isEqualTo(TEXT);
        }
        assertThat(stdin.closed).isFalse();
    }

    @Test
    void displayNames() {
        assertThat(InputOpener.displayName("-")).isEqualTo("<stdin>");
        assertThat(InputOpener.displayName("data/x.fa")).isEqualTo("data/x.fa");
    }

    @Test
    void missingFile() {
        String path = dir.resolve("nope.fa").toString();
        MissingInputException e = catchThrowableOfType(MissingInputException.class,
                () -> InputOpener.open(path, null));
        assertThat(e).hasMessage(path + ": no such file");
        assertThat(e.exitCode()).isEqualTo(66);
    }

    @Test
    void directory() {
        MissingInputException e = catchThrowableOfType(MissingInputException.class,
                () -> InputOpener.open(dir.toString(), null));
        assertThat(e).hasMessage(dir + ": is a directory");
        assertThat(e.exitCode()).isEqualTo(66);
    }

    @Test
    void unreadableFile() throws IOException {
        Path f = write("locked.fa", TEXT);
        Files.setPosixFilePermissions(f, PosixFilePermissions.fromString("---------"));
        // the superuser reads anything, so the check only means something for other users
        assumeTrue(!Files.isReadable(f), "running with permission to read a mode-000 file");
        MissingInputException e = catchThrowableOfType(MissingInputException.class,
                () -> InputOpener.open(f.toString(), null));
        assertThat(e).hasMessage(f + ": cannot be read (permission denied)");
        assertThat(e.exitCode()).isEqualTo(66);
    }

    @Test
    void truncatedGzipDataIsBadInput() throws IOException {
        byte[] big = new byte[200_000];
        for (int i = 0; i < big.length; i++) {
            big[i] = (byte) "ACGT\n".charAt((i * 7 + i / 13) % 5);
        }
        byte[] gz = gzip(big);
        Path f = write("cut.fa.gz", Arrays.copyOf(gz, gz.length / 2));
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> readAll(f.toString(), null));
        assertThat(e).hasMessage(f + ": truncated or corrupt gzip data");
        assertThat(e.exitCode()).isEqualTo(65);
    }

    @Test
    void truncatedGzipHeaderIsBadInputAtOpen() throws IOException {
        Path f = write("stub.gz", new byte[] {0x1f, (byte) 0x8b, 8});
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> InputOpener.open(f.toString(), null));
        assertThat(e).hasMessage(f + ": truncated or corrupt gzip data");
    }

    @Test
    void wrongChecksumInGzipTrailerIsBadInput() throws IOException {
        // RFC 1952 section 2.3.1: the member ends with CRC32 then ISIZE; flipping a CRC bit must be detected
        byte[] gz = gzip(TEXT);
        gz[gz.length - 8] ^= 0x01;
        Path f = write("crc.gz", gz);
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> readAll(f.toString(), null));
        assertThat(e).hasMessage(f + ": truncated or corrupt gzip data");
    }

    @Test
    void dataAfterTheLastMemberIsBadInput() throws IOException {
        // java.util.zip.GZIPInputStream ignores such data without a word; records in it would be lost silently
        byte[] gz = gzip(TEXT);
        byte[] secondCut = Arrays.copyOf(gzip(TEXT), 5); // a further member cut inside its 10-byte header
        String trailing = ": data after the end of the gzip data (a damaged further member, or bytes appended to "
                + "the file)";
        Path appended = write("appended.gz", concat(gz, "appended text\n".getBytes(StandardCharsets.US_ASCII)));
        Path zeros = write("zeros.gz", concat(gz, new byte[512]));
        Path cut = write("cut-second.gz", concat(gz, secondCut));
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAll(appended.toString(), null)))
                .hasMessage(appended + trailing);
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAll(zeros.toString(), null)))
                .hasMessage(zeros + trailing);
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAll(cut.toString(), null)))
                .hasMessage(cut + ": truncated or corrupt gzip data");
    }

    @Test
    void optionalHeaderFieldsAreSkipped() throws IOException {
        // RFC 1952 section 2.3.1: FEXTRA (length-prefixed), FNAME and FCOMMENT (zero-terminated), FHCRC (2 bytes)
        byte[] deflated = rawDeflate(TEXT);
        java.util.zip.CRC32 crc = new java.util.zip.CRC32();
        crc.update(TEXT);
        ByteArrayOutputStream member = new ByteArrayOutputStream();
        member.write(new byte[] {0x1f, (byte) 0x8b, 8, 2 | 4 | 8 | 16, 0, 0, 0, 0, 0, 3});
        member.write(new byte[] {3, 0, 'a', 'b', 'c'});
        member.write("reads.fa\0".getBytes(StandardCharsets.US_ASCII));
        member.write("an invented comment\0".getBytes(StandardCharsets.US_ASCII));
        java.util.zip.CRC32 headerCrc = new java.util.zip.CRC32();
        headerCrc.update(member.toByteArray());
        member.write((int) headerCrc.getValue() & 0xFF);
        member.write((int) (headerCrc.getValue() >>> 8) & 0xFF);
        int headerEnd = member.size();
        member.write(deflated);
        for (long v : new long[] {crc.getValue(), TEXT.length}) {
            for (int i = 0; i < 4; i++) {
                member.write((int) (v >>> (8 * i)) & 0xFF);
            }
        }
        byte[] gz = member.toByteArray();
        // the JDK's own reader is the reference that the hand-made member is well formed
        try (InputStream jdk = new java.util.zip.GZIPInputStream(new ByteArrayInputStream(gz))) {
            assertThat(jdk.readAllBytes()).isEqualTo(TEXT);
        }
        assertThat(readAll(write("fields.gz", gz).toString(), null)).isEqualTo(TEXT);
        gz[headerEnd - 1] ^= 0x01;
        Path damaged = write("header-crc.gz", gz);
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAll(damaged.toString(), null)))
                .hasMessage(damaged + ": truncated or corrupt gzip data");
    }

    @Test
    void blockGzipAsWrittenByHtsjdkReads() throws IOException {
        // BGZF (SAM/BAM specification, section 4.1): gzip members with an extra field, closed by an empty member;
        // htsjdk's writer is the independent producer
        byte[] text = new byte[300_000];
        for (int i = 0; i < text.length; i++) {
            text[i] = (byte) (i % 61 == 60 ? '\n' : "ACGT".charAt((i * 7 + i / 11) % 4));
        }
        text[0] = '>';
        Path f = dir.resolve("blocks.fa.gz");
        try (htsjdk.samtools.util.BlockCompressedOutputStream out =
                     new htsjdk.samtools.util.BlockCompressedOutputStream(f.toFile())) {
            out.write(text);
        }
        assertThat(readAll(f.toString(), null)).isEqualTo(text);
    }

    @Test
    void deviceFailureWhileReadingIsIoFailure() {
        InputStream failing = new SequenceInputStream(new ByteArrayInputStream(TEXT), new InputStream() {
            @Override
            public int read() throws IOException {
                throw new IOException("device gone");
            }
        });
        IoFailureException e = catchThrowableOfType(IoFailureException.class, () -> {
            try (InputStream in = InputOpener.open("-", failing)) {
                in.readAllBytes();
            }
        });
        assertThat(e).hasMessage("<stdin>: read failed: device gone");
        assertThat(((AnnotatorException) e).exitCode()).isEqualTo(74);
    }

    /**
     * Gzip inflated on a thread of its own: the same bytes (several hand-over buffers, several members), the
     * same one-line errors, every raw byte shown to the observer.
     */
    @Test
    void inflatingAheadGivesTheSameBytesAndTheSameErrors() throws IOException {
        byte[] big = new byte[5 * InputOpener.INFLATE_AHEAD_BUFFER + 12_345];
        java.util.SplittableRandom rng = new java.util.SplittableRandom(3);
        for (int i = 0; i < big.length; i++) {
            big[i] = i % 61 == 60 ? (byte) '\n' : (byte) "ACGT".charAt(rng.nextInt(4));
        }
        byte[] twoMembers = concat(gzip(big), gzip(TEXT));
        Path f = write("big.fa.gz", twoMembers);
        long[] seen = new long[1];
        byte[] read;
        try (InputStream in = InputOpener.open(f.toString(), null, (b, off, len) -> seen[0] += len, true)) {
            read = in.readAllBytes();
        }
        assertThat(read).isEqualTo(concat(big, TEXT));
        assertThat(seen[0]).isEqualTo(twoMembers.length);

        Path cut = write("cut-big.fa.gz", Arrays.copyOf(twoMembers, twoMembers.length / 2));
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAhead(cut.toString(), null)))
                .hasMessage(cut + ": truncated or corrupt gzip data");
        byte[] crc = gzip(TEXT);
        crc[crc.length - 8] ^= 0x01;
        Path badCrc = write("crc-ahead.gz", crc);
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAhead(badCrc.toString(), null)))
                .hasMessage(badCrc + ": truncated or corrupt gzip data");
        Path appended = write("appended-ahead.gz", concat(gzip(TEXT), "appended text\n".getBytes(StandardCharsets.US_ASCII)));
        assertThat(catchThrowableOfType(BadInputException.class, () -> readAhead(appended.toString(), null)))
                .hasMessageStartingWith(appended + ": data after the end of the gzip data");
        // plain input is read as it is, with or without the flag
        Path plain = write("plain-ahead.fa", TEXT);
        assertThat(readAhead(plain.toString(), null)).isEqualTo(TEXT);
    }

    @Test
    void deviceFailureWhileInflatingAheadIsIoFailure() throws IOException {
        InputStream failing = new SequenceInputStream(new ByteArrayInputStream(gzip(TEXT)), new InputStream() {
            @Override
            public int read() throws IOException {
                throw new IOException("device gone");
            }
        });
        IoFailureException e = catchThrowableOfType(IoFailureException.class, () -> readAhead("-", failing));
        assertThat(e).hasMessage("<stdin>: read failed: device gone");
    }

    @Test
    void closingBeforeTheEndStopsTheInflatingThread() throws Exception {
        byte[] big = new byte[8 * InputOpener.INFLATE_AHEAD_BUFFER];
        Arrays.fill(big, (byte) 'A');
        Path f = write("early.fa.gz", gzip(big));
        try (InputStream in = InputOpener.open(f.toString(), null, null, true)) {
            assertThat(in.readNBytes(10)).hasSize(10);
        }
        // close waits for the thread: none is left, and nothing more reaches an observer, once it returns
        assertThat(inflatingThreads()).isZero();
    }

    private static long inflatingThreads() {
        return Thread.getAllStackTraces().keySet().stream().filter(t -> t.getName().equals("input-inflate")).count();
    }

    private byte[] readAhead(String path, InputStream stdin) throws IOException {
        try (InputStream in = InputOpener.open(path, stdin, null, true)) {
            return in.readAllBytes();
        }
    }

    private byte[] readAll(String path, InputStream stdin) throws IOException {
        try (InputStream in = InputOpener.open(path, stdin)) {
            return in.readAllBytes();
        }
    }

    private Path write(String name, byte[] content) throws IOException {
        return Files.write(dir.resolve(name), content);
    }

    private static byte[] rawDeflate(byte[] data) {
        java.util.zip.Deflater deflater = new java.util.zip.Deflater(6, true);
        deflater.setInput(data);
        deflater.finish();
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        byte[] chunk = new byte[4096];
        while (!deflater.finished()) {
            out.write(chunk, 0, deflater.deflate(chunk));
        }
        deflater.end();
        return out.toByteArray();
    }

    static byte[] gzip(byte[] data) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (GZIPOutputStream out = new GZIPOutputStream(bytes)) {
            out.write(data);
        }
        return bytes.toByteArray();
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] out = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    private static final class ClosingProbe extends ByteArrayInputStream {
        boolean closed;

        ClosingProbe(byte[] data) {
            super(data);
        }

        @Override
        public void close() {
            closed = true;
        }
    }
}
