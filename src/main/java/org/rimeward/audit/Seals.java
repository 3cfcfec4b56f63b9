package org.rimeward.audit;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.GeneralSecurityException;
import java.security.KeyFactory;
import java.security.KeyPair;
import java.security.KeyPairGenerator;
import java.security.MessageDigest;
import java.security.PrivateKey;
import java.security.PublicKey;
import java.security.Signature;
import java.security.spec.PKCS8EncodedKeySpec;
import java.security.spec.X509EncodedKeySpec;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Base64;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import org.rimeward.io.BadInputException;

/**
 * Signed heads of the trail, kept beside it in {@code audit.db.seals}: one line per seal, each an
 * Ed25519 signature (the JDK's own EdDSA) over the head's {@code SEQ:HASH} and the time it was
 * sealed, with the public key that checks it. The private key lives outside the farm folder, so
 * whoever can rewrite the farm folder cannot sign a rebuilt trail with it.
 *
 * <p>The file is also the farm folder's memory that it kept a trail: a plan that finds the
 * database gone while its seals remain refuses to start a new one silently.
 */
public final class Seals {
  private static final String ALGORITHM = "Ed25519";
  private static final String DOMAIN = "rimeward-seal/1\n";

  private Seals() {}

  /** One seal as read from the file. */
  public record Seal(int line, ChainHead head, Instant at, PublicKey key, byte[] signature) {
    /** The first 16 hex digits of the SHA-256 of the public key: what a person compares. */
    public String keyFingerprint() {
      return fingerprint(key);
    }
  }

  /** The seals file of a trail: {@code audit.db.seals} beside {@code audit.db}. */
  public static Path fileFor(Path dbFile) {
    return dbFile.resolveSibling(dbFile.getFileName() + ".seals");
  }

  /** A new key pair: the private key (PKCS#8, mode 0600) at {@code keyFile}, the public one at {@code keyFile.pub}. */
  public static PublicKey newKey(Path keyFile) {
    if (Files.exists(keyFile)) {
      throw new BadInputException("--new-key: " + keyFile + " exists already; a key is never"
          + " overwritten. Use it with --key, or name a new file");
    }
    try {
      KeyPair pair = KeyPairGenerator.getInstance(ALGORITHM).generateKeyPair();
      Files.write(keyFile, base64(pair.getPrivate().getEncoded()), StandardOpenOption.CREATE_NEW);
      try {
        Files.setPosixFilePermissions(keyFile, PosixFilePermissions.fromString("rw-------"));
      } catch (UnsupportedOperationException e) {
        // Not a POSIX file system: the folder's own protection has to do.
      }
      Files.write(publicKeyFile(keyFile), base64(pair.getPublic().getEncoded()));
      return pair.getPublic();
    } catch (IOException e) {
      throw new BadInputException("--new-key: cannot write " + keyFile + ": " + e.getMessage(), e);
    } catch (GeneralSecurityException e) {
      throw new IllegalStateException("this Java has no Ed25519", e);
    }
  }

  public static Path publicKeyFile(Path keyFile) {
    return keyFile.resolveSibling(keyFile.getFileName() + ".pub");
  }

  /**
   * Signs {@code head} with the private key in {@code keyFile} and appends the seal to the trail's
   * seals file.
   *
   * @throws BadInputException when the key sits inside the farm folder or cannot be read
   */
  public static Seal seal(Path dbFile, ChainHead head, Path keyFile, Instant at) {
    Path farm = dbFile.toAbsolutePath().normalize().getParent();
    Path key = keyFile.toAbsolutePath().normalize();
    try {
      key = keyFile.toRealPath();
      farm = farm.toRealPath();
    } catch (IOException e) {
      throw new BadInputException("--key: " + keyFile + " cannot be read: " + e.getMessage(), e);
    }
    if (key.startsWith(farm)) {
      throw new BadInputException("--key: " + keyFile + " is inside the farm folder " + farm
          + "; keep the signing key where those who can change the farm folder cannot read it"
          + " (another disk, another account), or a rewritten trail could be sealed again");
    }
    try {
      byte[] der = Base64.getDecoder().decode(Files.readString(key, StandardCharsets.US_ASCII).strip());
      KeyFactory kf = KeyFactory.getInstance(ALGORITHM);
      PrivateKey priv = kf.generatePrivate(new PKCS8EncodedKeySpec(der));
      PublicKey pub = kf.generatePublic(new X509EncodedKeySpec(
          Base64.getDecoder().decode(Files.readString(publicKeyFile(key)).strip())));
      Signature s = Signature.getInstance(ALGORITHM);
      s.initSign(priv);
      s.update(signed(head, at));
      byte[] sig = s.sign();
      String line = "seal " + head + " " + at + " " + Base64.getEncoder().encodeToString(
          pub.getEncoded()) + " " + Base64.getEncoder().encodeToString(sig) + "\n";
      Files.writeString(fileFor(dbFile), line, StandardCharsets.US_ASCII,
          StandardOpenOption.CREATE, StandardOpenOption.APPEND, StandardOpenOption.SYNC);
      Seal seal = new Seal(0, head, at, pub, sig);
      if (!valid(seal)) {
        throw new BadInputException("--key: " + keyFile + " and " + publicKeyFile(key)
            + " are not one key pair");
      }
      return seal;
    } catch (IOException | IllegalArgumentException e) {
      throw new BadInputException("--key: " + keyFile + " (and " + publicKeyFile(key) + ") cannot"
          + " be used: " + e.getMessage() + "; make one with 'rimeward audit seal --new-key FILE'",
          e);
    } catch (GeneralSecurityException e) {
      throw new BadInputException("--key: " + keyFile + " is not an Ed25519 key made by"
          + " 'rimeward audit seal --new-key': " + e.getMessage(), e);
    }
  }

  /**
   * Every seal in the trail's seals file, oldest first; none when there is no file.
   *
   * @throws AuditIntegrityException naming the line of a seal that cannot be read
   */
  public static List<Seal> read(Path dbFile) {
    Path f = fileFor(dbFile);
    List<String> lines;
    try {
      lines = Files.readAllLines(f, StandardCharsets.US_ASCII);
    } catch (NoSuchFileException e) {
      return List.of();
    } catch (IOException e) {
      throw new AuditUnavailableException(f + ": cannot be read: " + e.getMessage(), e);
    }
    List<Seal> out = new ArrayList<>();
    for (int i = 0; i < lines.size(); i++) {
      String l = lines.get(i).strip();
      if (l.isEmpty()) {
        continue;
      }
      String[] p = l.split(" ");
      try {
        if (p.length != 5 || !p[0].equals("seal")) {
          throw new IllegalArgumentException("not 'seal SEQ:HASH TIME KEY SIGNATURE'");
        }
        PublicKey key = KeyFactory.getInstance(ALGORITHM).generatePublic(
            new X509EncodedKeySpec(Base64.getDecoder().decode(p[3])));
        out.add(new Seal(i + 1, ChainHead.parse(p[1]), Instant.parse(p[2]), key,
            Base64.getDecoder().decode(p[4])));
      } catch (RuntimeException | GeneralSecurityException e) {
        throw new AuditIntegrityException(f + ":" + (i + 1) + ": this seal cannot be read ("
            + e.getMessage() + "): the seals file was changed or damaged");
      }
    }
    return out;
  }

  /** Whether the seal's signature matches its head and time under its own key. */
  public static boolean valid(Seal seal) {
    try {
      Signature s = Signature.getInstance(ALGORITHM);
      s.initVerify(seal.key());
      s.update(signed(seal.head(), seal.at()));
      return s.verify(seal.signature());
    } catch (GeneralSecurityException e) {
      return false;
    }
  }

  /** The public key in a {@code .pub} file as {@code --new-key} writes it. */
  public static PublicKey readPublicKey(Path pubFile) {
    try {
      return KeyFactory.getInstance(ALGORITHM).generatePublic(new X509EncodedKeySpec(
          Base64.getDecoder().decode(Files.readString(pubFile, StandardCharsets.US_ASCII).strip())));
    } catch (IOException | IllegalArgumentException | GeneralSecurityException e) {
      throw new BadInputException("--public-key: " + pubFile + " is not a public key written by"
          + " 'rimeward audit seal --new-key' (" + e.getMessage() + ")", e);
    }
  }

  public static String fingerprint(PublicKey key) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
          .digest(key.getEncoded())).substring(0, 16);
    } catch (GeneralSecurityException e) {
      throw new IllegalStateException(e);
    }
  }

  static Optional<Seal> latest(List<Seal> seals) {
    return seals.isEmpty() ? Optional.empty() : Optional.of(seals.get(seals.size() - 1));
  }

  private static byte[] signed(ChainHead head, Instant at) {
    return (DOMAIN + head + "\n" + at + "\n").getBytes(StandardCharsets.US_ASCII);
  }

  private static byte[] base64(byte[] der) {
    return (Base64.getEncoder().encodeToString(der) + "\n").getBytes(StandardCharsets.US_ASCII);
  }
}
