package org.rimeward.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Locale;

/**
 * One input file read the one way Rimeward reads text: at most a stated number of bytes (so a
 * device such as /dev/zero or an endless pipe is refused within seconds, not by running out of
 * memory), strictly as UTF-8 (a bad byte is named by line and column), with a leading byte-order
 * mark dropped. The exact bytes are kept for the audit trail.
 *
 * @param label the file as messages name it
 * @param bytes the bytes as read
 * @param text the decoded text, without a byte-order mark
 */
public record TextFile(String label, byte[] bytes, String text) {
  /** The largest farm, crop or rule file read: far above any real one (the demo's are a few KB). */
  public static final long MAX_DOCUMENT_BYTES = 4L << 20;
  /** The largest forecast or readings table read: about 100,000 rows, years of hourly values. */
  public static final long MAX_TABLE_BYTES = 16L << 20;

  public TextFile {
    bytes = bytes.clone();
  }

  @Override
  public byte[] bytes() {
    return bytes.clone();
  }

  /**
   * Reads {@code path}. {@code what} names the kind of file for messages ("farm file",
   * "forecast"), {@code remedy} says what to give instead when it is missing.
   */
  public static TextFile read(Path path, long maxBytes, String what, String remedy) {
    String label = path.toString();
    if (Files.isDirectory(path)) {
      throw BadInputException.at(label, "is a folder, not a " + what + "; " + remedy);
    }
    byte[] bytes;
    try (InputStream in = Files.newInputStream(path)) {
      bytes = in.readNBytes((int) Math.min(Integer.MAX_VALUE - 16, maxBytes + 1));
    } catch (NoSuchFileException e) {
      throw BadInputException.at(label, "no such " + what + "; " + remedy);
    } catch (AccessDeniedException e) {
      throw BadInputException.at(label, "permission denied reading the " + what
          + "; make it readable for this account");
    } catch (IOException e) {
      throw new BadInputException(label + ": could not read the " + what + " ("
          + Text.quote(String.valueOf(e.getMessage())) + ")", e);
    }
    if (bytes.length > maxBytes) {
      throw BadInputException.at(label, String.format(Locale.ROOT, "is larger than %s, far more"
          + " than any %s; check that this is the right file (a device or an endless stream is"
          + " not a file)", size(maxBytes), what));
    }
    return decode(label, bytes);
  }

  /** Decodes bytes already read (from the trail, or a download) the same strict way. */
  public static TextFile decode(String label, byte[] bytes) {
    CharsetDecoder dec = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
    ByteBuffer in = ByteBuffer.wrap(bytes);
    CharBuffer out = CharBuffer.allocate((int) Math.min(Integer.MAX_VALUE - 16, bytes.length + 1L));
    CoderResult r = dec.decode(in, out, true);
    if (!r.isError()) {
      r = dec.flush(out);
    }
    if (r.isError()) {
      out.flip();
      String before = out.toString();
      int line = 1;
      int col = 1;
      for (int i = 0; i < before.length(); i++) {
        if (before.charAt(i) == '\n') {
          line++;
          col = 1;
        } else {
          col++;
        }
      }
      throw BadInputException.at(label + ":" + line, String.format(Locale.ROOT,
          "not UTF-8 text (byte 0x%02X at column %d); save the file as UTF-8",
          bytes[in.position()] & 0xFF, col));
    }
    out.flip();
    String text = out.toString();
    if (text.startsWith("\uFEFF")) {
      text = text.substring(1);
    }
    return new TextFile(label, bytes, text);
  }

  private static String size(long bytes) {
    return bytes >= 1 << 20 ? (bytes >> 20) + " MB" : (bytes >> 10) + " KB";
  }
}
