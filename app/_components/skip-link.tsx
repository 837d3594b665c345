'use client'

/** "Skip to main content": the first stop for the keyboard; focuses the page's main region. */
export function SkipLink() {
  return (
    <a
      href="#main"
      className="skip-link"
      onClick={(e) => {
        const main = document.getElementById('main') ?? document.querySelector('main')
        if (!main) return
        e.preventDefault()
        if (!main.hasAttribute('tabindex')) main.setAttribute('tabindex', '-1')
        main.focus()
        main.scrollIntoView()
      }}
    >
      Skip to main content
    </a>
  )
}
