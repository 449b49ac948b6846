package org.precedent.api.system;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.GrantedAuthority;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * Who is calling: any role may ask, so that a page can check typed credentials at sign-in and
 * show only what the caller's role may use.
 */
@RestController
class CallerController {
  @GetMapping("/api/v1/me")
  Map<String, Object> me(Authentication who) {
    String role = who.getAuthorities().stream().map(GrantedAuthority::getAuthority)
        .filter(a -> a.startsWith("ROLE_")).map(a -> a.substring(5).toLowerCase(Locale.ROOT))
        .findFirst().orElse("none");
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("name", who.getName());
    out.put("role", role);
    return out;
  }
}
