package sitebuild

import (
	"bytes"
	"crypto/sha256"
	"encoding/base64"
	"fmt"
	"regexp"
)

// offlinePage builds the single-file version of the page: style and script
// inline under a Content-Security-Policy that allows exactly their hashes,
// the worker's source (wasm_exec.js and worker.js) and the demo data as
// inert text blocks, and the module as base64. app.js sees the text blocks
// and starts the worker from a blob: URL, handing it the module's bytes, so
// nothing is fetched: the file works from disk with networking off.
func offlinePage(read func(string) ([]byte, error), assets map[string]*asset) ([]byte, error) {
	page, err := read("index.html")
	if err != nil {
		return nil, err
	}
	style := assets["style.css"].data
	script := assets["app.js"].data
	workerSource := append(append(append([]byte{}, assets["wasm_exec.js"].data...), '\n'), assets["worker.js"].data...)
	for name, block := range map[string][]byte{"script": script, "worker": workerSource, "demo": assets["demo.tsv"].data} {
		if bytes.Contains(bytes.ToLower(block), []byte("</script")) {
			return nil, fmt.Errorf("offline page: the %s would end its script element early", name)
		}
	}
	policy := fmt.Sprintf("default-src 'none'; script-src '%s' 'wasm-unsafe-eval'; worker-src blob:; style-src '%s'; img-src data: blob:; base-uri 'none'; form-action 'none'",
		cspHash(script), cspHash(style))
	csp := regexp.MustCompile(`(<meta http-equiv="Content-Security-Policy" content=")[^"]*(")`)
	if !csp.Match(page) {
		return nil, fmt.Errorf("offline page: index.html has no Content-Security-Policy meta tag")
	}
	page = csp.ReplaceAll(page, []byte("${1}"+policy+"${2}"))
	page, err = replaceOnce(page, `<link rel="stylesheet" href="style.css">`, "<style>"+string(style)+"</style>")
	if err != nil {
		return nil, err
	}
	if page, err = replaceOnce(page, `<script src="app.js" defer></script>`+"\n", ""); err != nil {
		return nil, err
	}
	for _, file := range []string{`midrank.wasm" as="fetch" type="application/wasm"`, `demo.tsv" as="fetch"`} { // both are inside the page
		if page, err = replaceOnce(page, `<link rel="preload" href="`+file+` crossorigin>`+"\n", ""); err != nil {
			return nil, err
		}
	}
	var tail bytes.Buffer
	tail.WriteString(`<script type="text/plain" id="worker-source">`)
	tail.Write(workerSource)
	tail.WriteString("</script>\n" + `<script type="application/octet-stream" id="module-base64">`)
	tail.WriteString(base64.StdEncoding.EncodeToString(assets["midrank.wasm"].data))
	tail.WriteString("</script>\n" + `<script type="text/plain" id="demo-data">`)
	tail.Write(assets["demo.tsv"].data)
	tail.WriteString("</script>\n<script>")
	tail.Write(script)
	tail.WriteString("</script>\n</body>")
	return replaceOnce(page, "</body>", tail.String())
}

func replaceOnce(page []byte, old, new string) ([]byte, error) {
	if bytes.Count(page, []byte(old)) != 1 {
		return nil, fmt.Errorf("offline page: expected %q once in index.html", old)
	}
	return bytes.Replace(page, []byte(old), []byte(new), 1), nil
}

// cspHash is the CSP source expression allowing an inline element's text.
func cspHash(text []byte) string {
	sum := sha256.Sum256(text)
	return "sha256-" + base64.StdEncoding.EncodeToString(sum[:])
}
