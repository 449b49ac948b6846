package org.precedent.api.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.logging.Level;
import org.junit.jupiter.api.Assumptions;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TimeoutException;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * A real headless Chromium driven through chromedriver, both from the system's packages (Debian:
 * {@code chromium}, {@code chromium-driver}); nothing is downloaded.
 */
public final class Browser implements AutoCloseable {
  static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  static final Path DRIVER = Path.of("/usr/bin/chromedriver");

  private final Path profile;
  private final ChromeDriver driver;
  private final String base;

  private Browser(String base) throws IOException {
    this.base = base;
    this.profile = Files.createTempDirectory("precedent-browser-");
    ChromeOptions options = new ChromeOptions().setBinary(CHROMIUM.toFile());
    // No network of its own besides the pages under test, and a throw-away profile.
    options.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
        "--no-first-run", "--disable-background-networking", "--disable-component-update",
        "--disable-sync", "--disable-dev-shm-usage", "--user-data-dir=" + profile);
    // The page's console, so that a failing wait can say what the page said.
    LoggingPreferences logs = new LoggingPreferences();
    logs.enable(LogType.BROWSER, Level.ALL);
    options.setCapability("goog:loggingPrefs", logs);
    ChromeDriverService service = new ChromeDriverService.Builder()
        .usingDriverExecutable(DRIVER.toFile()).usingAnyFreePort().build();
    this.driver = new ChromeDriver(service, options);
    driver.manage().window().setSize(new Dimension(1280, 1000));
  }

  /** Opens a browser on the service at {@code base}; skips the test when Chromium is absent. */
  public static Browser open(String base) {
    Assumptions.assumeTrue(Files.isExecutable(CHROMIUM), "skipped: " + CHROMIUM + " is absent "
        + "(install the Debian packages chromium and chromium-driver to run the browser tests)");
    try {
      return new Browser(base);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  public void go(String path) {
    driver.get(base + path);
  }

  public WebElement find(String css) {
    return driver.findElement(By.cssSelector(css));
  }

  public java.util.List<WebElement> all(String css) {
    return driver.findElements(By.cssSelector(css));
  }

  /** Waits (up to a minute: a decision on a shared machine can be slow) for a visible element. */
  public WebElement visible(String css) {
    try {
      return waiting().until(ExpectedConditions.visibilityOfElementLocated(By.cssSelector(css)));
    } catch (TimeoutException e) {
      throw new AssertionError("never visible: " + css + "; the page's console: " + console(), e);
    }
  }

  /** Waits until the element's text contains {@code text}. */
  public WebElement showing(String css, String text) {
    try {
      waiting().until(ExpectedConditions.textToBePresentInElementLocated(By.cssSelector(css),
          text));
    } catch (TimeoutException e) {
      throw new AssertionError(css + " never showed '" + text + "'; the page's console: "
          + console(), e);
    }
    return find(css);
  }

  /** What the page wrote to its console since the last call. */
  public String console() {
    StringBuilder s = new StringBuilder();
    for (LogEntry entry : driver.manage().logs().get(LogType.BROWSER)) {
      s.append('\n').append(entry.getLevel()).append(' ').append(entry.getMessage());
    }
    return s.toString();
  }

  public WebDriverWait waiting() {
    return new WebDriverWait(driver, Duration.ofSeconds(60));
  }

  public Object script(String js, Object... args) {
    return ((JavascriptExecutor) driver).executeScript(js, args);
  }

  public void type(String css, String text) {
    WebElement e = find(css);
    e.clear();
    e.sendKeys(text);
  }

  /** Saves what the browser shows, for a person to look at; the page is made tall enough to fit. */
  public void screenshot(Path file) {
    Number height = (Number) script("return document.documentElement.scrollHeight");
    driver.manage().window().setSize(new Dimension(1280, Math.max(1000, height.intValue() + 140)));
    try {
      Files.write(file, driver.getScreenshotAs(OutputType.BYTES));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } finally {
      driver.manage().window().setSize(new Dimension(1280, 1000));
    }
  }

  @Override
  public void close() {
    driver.quit();
    TrainedData.delete(profile);
  }
}
