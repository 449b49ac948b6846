package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.net.ConnectException;
import java.net.Inet4Address;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.NetworkInterface;
import java.net.Socket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.KeyStore;
import java.util.Base64;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import javax.net.ssl.SSLContext;
import javax.net.ssl.TrustManagerFactory;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;

/**
 * The service as README's settings describe it: API keys alone (the demo users are off), TLS
 * from a key store, the default bind on loopback, and a data directory only its owner can read.
 */
@ExtendWith(OutputCaptureExtension.class)
class ServiceSettingsTest {
  static final String KEY = "ops-key-" + Long.toHexString(System.nanoTime());
  static final String STORE_PASSWORD = "test-store-password";
  static Path tls;
  static Path data;
  static RunningService service;
  static String startOutput;
  static HttpClient https;

  @BeforeAll
  static void start(CapturedOutput output) throws Exception {
    tls = Files.createTempDirectory("precedent-tls-");
    Path store = tls.resolve("precedent.p12");
    // A self-signed certificate for localhost, made by the JDK's own keytool.
    Process keytool = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin",
        "keytool").toString(), "-genkeypair", "-alias", "precedent", "-keyalg", "EC",
        "-groupname", "secp256r1", "-dname", "CN=localhost", "-ext",
        "san=dns:localhost,ip:127.0.0.1", "-validity", "2", "-storetype", "PKCS12",
        "-keystore", store.toString(), "-storepass", STORE_PASSWORD).redirectErrorStream(true)
        .start();
    String said = new String(keytool.getInputStream().readAllBytes());
    assertTrue(keytool.waitFor(60, TimeUnit.SECONDS) && keytool.exitValue() == 0, said);
    https = HttpClient.newBuilder().sslContext(trusting(store)).build();

    data = TrainedData.copy();
    // As an older version, or a lax umask, left it: readable by everyone.
    try (Stream<Path> walk = Files.walk(data)) {
      for (Path p : walk.toList()) {
        Files.setPosixFilePermissions(p, PosixFilePermissions.fromString(
            Files.isDirectory(p) ? "rwxr-xr-x" : "rw-r--r--"));
      }
    }
    service = RunningService.startOn(data, "--precedent.security.keys=ops:" + KEY + ":manager",
        "--server.ssl.key-store=" + store, "--server.ssl.key-store-password=" + STORE_PASSWORD,
        "--server.ssl.key-store-type=PKCS12");
    startOutput = output.getAll();
  }

  @AfterAll
  static void stop() {
    if (service != null) {
      service.close();
    }
    TrainedData.delete(tls);
  }

  private static SSLContext trusting(Path store) throws Exception {
    KeyStore keys = KeyStore.getInstance("PKCS12");
    try (InputStream in = Files.newInputStream(store)) {
      keys.load(in, STORE_PASSWORD.toCharArray());
    }
    KeyStore trusted = KeyStore.getInstance("PKCS12");
    trusted.load(null, null);
    trusted.setCertificateEntry("precedent", keys.getCertificate("precedent"));
    TrustManagerFactory tmf = TrustManagerFactory.getInstance(
        TrustManagerFactory.getDefaultAlgorithm());
    tmf.init(trusted);
    SSLContext context = SSLContext.getInstance("TLS");
    context.init(null, tmf.getTrustManagers(), null);
    return context;
  }

  private static int port() {
    return URI.create(service.http().base()).getPort();
  }

  private static HttpResponse<String> get(String path, String header, String value)
      throws Exception {
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("https://localhost:" + port()
        + path));
    if (header != null) {
      b.header(header, value);
    }
    return https.send(b.build(), HttpResponse.BodyHandlers.ofString());
  }

  @Test
  void keysAloneSwitchOffTheDemoUsersAndKeysAndNoDemoWarningIsPrinted() throws Exception {
    assertEquals(200, get("/api/v1/threshold", "X-Precedent-Key", KEY).statusCode());
    assertEquals(401, get("/api/v1/threshold", "X-Precedent-Key", "demo-manager-key")
        .statusCode());
    assertEquals(401, get("/api/v1/threshold", "Authorization", "Basic " + Base64.getEncoder()
        .encodeToString("manager:manager-demo-password".getBytes())).statusCode());
    assertFalse(startOutput.contains("demo credentials in force"), startOutput);
  }

  @Test
  void theServiceSpeaksTlsFromTheConfiguredKeyStore() throws Exception {
    HttpResponse<String> health = get("/actuator/health", null, null);
    assertEquals(200, health.statusCode());
    assertEquals("https", health.uri().getScheme());
    // Plain HTTP on the same port is turned away by Tomcat (400, "requires TLS"; from memory).
    HttpResponse<String> plain = HttpClient.newHttpClient().send(HttpRequest.newBuilder(
        URI.create("http://localhost:" + port() + "/actuator/health")).build(),
        HttpResponse.BodyHandlers.ofString());
    assertEquals(400, plain.statusCode(), plain.body());
  }

  @Test
  void byDefaultItListensOnLoopbackOnly() throws Exception {
    Optional<InetAddress> outside = NetworkInterface.networkInterfaces()
        .flatMap(NetworkInterface::inetAddresses)
        .filter(a -> a instanceof Inet4Address && !a.isLoopbackAddress()).findFirst();
    Assumptions.assumeTrue(outside.isPresent(), "this machine has no address but loopback");
    try (Socket ok = new Socket()) {
      ok.connect(new InetSocketAddress(InetAddress.getLoopbackAddress(), port()), 5_000);
    }
    try (Socket refused = new Socket()) {
      assertThrows(ConnectException.class, () -> refused.connect(
          new InetSocketAddress(outside.get(), port()), 5_000), outside.get().toString());
    }
  }

  @Test
  void theDataDirectoryAndTheDatabaseAreTheOwnersAlone() throws Exception {
    Path database = data.resolve("service/precedent.mv.db");
    assertTrue(Files.isRegularFile(database));
    assertEquals("rw-------", PosixFilePermissions.toString(
        Files.getPosixFilePermissions(database)));
    assertEquals("rwx------", PosixFilePermissions.toString(
        Files.getPosixFilePermissions(data)));
    try (Stream<Path> walk = Files.walk(data)) {
      List<String> open = walk.map(p -> {
        try {
          return data.relativize(p) + " " + PosixFilePermissions.toString(
              Files.getPosixFilePermissions(p));
        } catch (IOException e) {
          throw new java.io.UncheckedIOException(e);
        }
      }).filter(s -> !s.endsWith("------")).toList();
      assertEquals(List.of(), open);
    }
  }
}
