package org.precedent.api.system;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.util.Set;
import org.springframework.boot.context.event.ApplicationEnvironmentPreparedEvent;
import org.springframework.context.ApplicationListener;

/**
 * Before anything opens it: the service's H2 database file (and its folder) must be writable. H2
 * would otherwise open a read-only file read-only, and the service would start and then fail on the
 * first ticket queued or threshold changed.
 */
final class DatabaseFileCheck implements ApplicationListener<ApplicationEnvironmentPreparedEvent> {
  private static final String H2_FILE = "jdbc:h2:file:";

  @Override
  public void onApplicationEvent(ApplicationEnvironmentPreparedEvent event) {
    String url = event.getEnvironment().getProperty("spring.datasource.url", "");
    if (url.startsWith(H2_FILE)) {
      String base = url.substring(H2_FILE.length());
      int options = base.indexOf(';');
      check(Path.of(options < 0 ? base : base.substring(0, options)));
    }
  }

  static void check(Path base) {
    Path file = base.resolveSibling(base.getFileName() + ".mv.db");
    Path dir = file.toAbsolutePath().getParent();
    if (Files.exists(file) && !writable(file)) {
      throw new ServiceStartException(file + ": the service database file is read-only; the "
          + "service keeps its queue, feedback and audit records there: make it writable for the "
          + "user the service runs as (chmod u+w)", null);
    }
    if (Files.isDirectory(dir) && !writable(dir)) {
      throw new ServiceStartException(dir + ": the service database folder is read-only; make it "
          + "writable for the user the service runs as (chmod u+w)", null);
    }
  }

  /**
   * Writable by its owner's permission bits, not only by the caller's access: run as root, every
   * file passes {@link Files#isWritable}, yet a file marked read-only was meant to stay so.
   */
  private static boolean writable(Path p) {
    if (!Files.isWritable(p)) {
      return false;
    }
    try {
      Set<PosixFilePermission> mode = Files.getPosixFilePermissions(p);
      return mode.contains(PosixFilePermission.OWNER_WRITE);
    } catch (UnsupportedOperationException | IOException e) {
      return true;
    }
  }
}
