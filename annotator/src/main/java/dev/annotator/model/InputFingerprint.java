package dev.annotator.model;

/**
 * One input file of a training run as the provenance records it.
 *
 * @param name   the path as given on the command line
 * @param bytes  its size
 * @param sha256 SHA-256 of its bytes (as stored, compressed or not), 64 lowercase hexadecimal digits
 */
public record InputFingerprint(String name, long bytes, String sha256) {
}
