module midrank

go 1.26.0

require (
	github.com/andybalholm/brotli v1.3.0
	github.com/chromedp/cdproto v0.159.0
	github.com/chromedp/chromedp v0.23.0
	github.com/evanw/esbuild v0.28.2
	github.com/syumai/workers v0.33.0
	github.com/tdewolff/minify/v2 v2.25.0
	gonum.org/v1/gonum v0.17.0
)

require (
	github.com/go-json-experiment/json v0.0.0-20260213210345-44df1a37e875 // indirect
	github.com/tdewolff/parse/v2 v2.25.0 // indirect
	golang.org/x/sys v0.50.0 // indirect
)

tool github.com/syumai/workers/cmd/workers-assets-gen
